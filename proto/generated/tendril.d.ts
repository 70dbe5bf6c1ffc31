import * as $protobuf from "protobufjs";
import Long = require("long");

/** Namespace tendril. */
export namespace tendril {

    /**
     * Properties of an OffLatticeDla2dParams.
     * @deprecated Use tendril.OffLatticeDla2dParams.$Properties instead.
     */
    interface IOffLatticeDla2dParams extends tendril.OffLatticeDla2dParams.$Properties {
    }

    /** Represents an OffLatticeDla2dParams. */
    class OffLatticeDla2dParams {

        /**
         * Constructs a new OffLatticeDla2dParams.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.OffLatticeDla2dParams.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** OffLatticeDla2dParams minStep. */
        minStep: number;

        /** OffLatticeDla2dParams launchMargin. */
        launchMargin: number;

        /**
         * Creates a new OffLatticeDla2dParams instance using the specified properties.
         * @param [properties] Properties to set
         * @returns OffLatticeDla2dParams instance
         */
        static create(properties: tendril.OffLatticeDla2dParams.$Shape): tendril.OffLatticeDla2dParams & tendril.OffLatticeDla2dParams.$Shape;
        static create(properties?: tendril.OffLatticeDla2dParams.$Properties): tendril.OffLatticeDla2dParams;

        /**
         * Encodes the specified OffLatticeDla2dParams message. Does not implicitly {@link tendril.OffLatticeDla2dParams.verify|verify} messages.
         * @param message OffLatticeDla2dParams message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.OffLatticeDla2dParams.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified OffLatticeDla2dParams message, length delimited. Does not implicitly {@link tendril.OffLatticeDla2dParams.verify|verify} messages.
         * @param message OffLatticeDla2dParams message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.OffLatticeDla2dParams.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes an OffLatticeDla2dParams message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.OffLatticeDla2dParams & tendril.OffLatticeDla2dParams.$Shape} OffLatticeDla2dParams
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.OffLatticeDla2dParams & tendril.OffLatticeDla2dParams.$Shape;

        /**
         * Decodes an OffLatticeDla2dParams message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.OffLatticeDla2dParams & tendril.OffLatticeDla2dParams.$Shape} OffLatticeDla2dParams
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.OffLatticeDla2dParams & tendril.OffLatticeDla2dParams.$Shape;

        /**
         * Verifies an OffLatticeDla2dParams message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates an OffLatticeDla2dParams message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns OffLatticeDla2dParams
         */
        static fromObject(object: { [k: string]: any }): tendril.OffLatticeDla2dParams;

        /**
         * Creates a plain object from an OffLatticeDla2dParams message. Also converts values to other types if specified.
         * @param message OffLatticeDla2dParams
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.OffLatticeDla2dParams, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this OffLatticeDla2dParams to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for OffLatticeDla2dParams
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace OffLatticeDla2dParams {

        /** Properties of an OffLatticeDla2dParams. */
        interface $Properties {

            /** OffLatticeDla2dParams minStep */
            minStep?: (number|null);

            /** OffLatticeDla2dParams launchMargin */
            launchMargin?: (number|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of an OffLatticeDla2dParams. */
        type $Shape = tendril.OffLatticeDla2dParams.$Properties;
    }

    /**
     * Properties of a ModelParams.
     * @deprecated Use tendril.ModelParams.$Properties instead.
     */
    interface IModelParams extends tendril.ModelParams.$Properties {
    }

    /** Represents a ModelParams. */
    class ModelParams {

        /**
         * Constructs a new ModelParams.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.ModelParams.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** ModelParams offlatticeDla2d. */
        offlatticeDla2d?: (tendril.OffLatticeDla2dParams.$Properties|null);

        /** ModelParams kind. */
        kind: string;

        /** ModelParams params. */
        params: { [k: string]: number };

        /** ModelParams legacy. */
        legacy?: "offlatticeDla2d";

        /**
         * Creates a new ModelParams instance using the specified properties.
         * @param [properties] Properties to set
         * @returns ModelParams instance
         */
        static create(properties: tendril.ModelParams.$Shape): tendril.ModelParams & tendril.ModelParams.$Shape;
        static create(properties?: tendril.ModelParams.$Properties): tendril.ModelParams;

        /**
         * Encodes the specified ModelParams message. Does not implicitly {@link tendril.ModelParams.verify|verify} messages.
         * @param message ModelParams message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.ModelParams.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified ModelParams message, length delimited. Does not implicitly {@link tendril.ModelParams.verify|verify} messages.
         * @param message ModelParams message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.ModelParams.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a ModelParams message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.ModelParams & tendril.ModelParams.$Shape} ModelParams
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.ModelParams & tendril.ModelParams.$Shape;

        /**
         * Decodes a ModelParams message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.ModelParams & tendril.ModelParams.$Shape} ModelParams
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.ModelParams & tendril.ModelParams.$Shape;

        /**
         * Verifies a ModelParams message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a ModelParams message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns ModelParams
         */
        static fromObject(object: { [k: string]: any }): tendril.ModelParams;

        /**
         * Creates a plain object from a ModelParams message. Also converts values to other types if specified.
         * @param message ModelParams
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.ModelParams, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this ModelParams to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for ModelParams
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace ModelParams {

        /** Properties of a ModelParams. */
        interface $Properties {

            /** ModelParams offlatticeDla2d */
            offlatticeDla2d?: (tendril.OffLatticeDla2dParams.$Properties|null);

            /** ModelParams kind */
            kind?: (string|null);

            /** ModelParams params */
            params?: ({ [k: string]: number }|null);

            /** ModelParams legacy */
            legacy?: "offlatticeDla2d";

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Narrowed shape of a ModelParams. */
        type $Shape = {
          offlatticeDla2d?: tendril.OffLatticeDla2dParams.$Shape|null;
          kind?: string|null;
          params?: { [k: string]: number }|null;
          $unknowns?: Uint8Array[];
        } & (
          ({ legacy?: undefined; offlatticeDla2d?: null }|{ legacy?: "offlatticeDla2d"; offlatticeDla2d: tendril.OffLatticeDla2dParams.$Shape })
        );
    }

    /**
     * Properties of a RunTask.
     * @deprecated Use tendril.RunTask.$Properties instead.
     */
    interface IRunTask extends tendril.RunTask.$Properties {
    }

    /** Represents a RunTask. */
    class RunTask {

        /**
         * Constructs a new RunTask.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.RunTask.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** RunTask contractVersion. */
        contractVersion: number;

        /** RunTask ensembleId. */
        ensembleId: string;

        /** RunTask runIndex. */
        runIndex: number;

        /** RunTask ensembleSeed. */
        ensembleSeed: string;

        /** RunTask model. */
        model?: (tendril.ModelParams.$Properties|null);

        /** RunTask particles. */
        particles: number;

        /** RunTask recordsPerDecade. */
        recordsPerDecade: number;

        /** RunTask checkpointIntervalSeconds. */
        checkpointIntervalSeconds: number;

        /** RunTask checkpointEveryParticles. */
        checkpointEveryParticles: number;

        /** RunTask engineVersion. */
        engineVersion: string;

        /** RunTask keepPositions. */
        keepPositions: boolean;

        /**
         * Creates a new RunTask instance using the specified properties.
         * @param [properties] Properties to set
         * @returns RunTask instance
         */
        static create(properties: tendril.RunTask.$Shape): tendril.RunTask & tendril.RunTask.$Shape;
        static create(properties?: tendril.RunTask.$Properties): tendril.RunTask;

        /**
         * Encodes the specified RunTask message. Does not implicitly {@link tendril.RunTask.verify|verify} messages.
         * @param message RunTask message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.RunTask.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified RunTask message, length delimited. Does not implicitly {@link tendril.RunTask.verify|verify} messages.
         * @param message RunTask message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.RunTask.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a RunTask message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.RunTask & tendril.RunTask.$Shape} RunTask
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.RunTask & tendril.RunTask.$Shape;

        /**
         * Decodes a RunTask message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.RunTask & tendril.RunTask.$Shape} RunTask
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.RunTask & tendril.RunTask.$Shape;

        /**
         * Verifies a RunTask message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a RunTask message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns RunTask
         */
        static fromObject(object: { [k: string]: any }): tendril.RunTask;

        /**
         * Creates a plain object from a RunTask message. Also converts values to other types if specified.
         * @param message RunTask
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.RunTask, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this RunTask to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for RunTask
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace RunTask {

        /** Properties of a RunTask. */
        interface $Properties {

            /** RunTask contractVersion */
            contractVersion?: (number|null);

            /** RunTask ensembleId */
            ensembleId?: (string|null);

            /** RunTask runIndex */
            runIndex?: (number|null);

            /** RunTask ensembleSeed */
            ensembleSeed?: (string|null);

            /** RunTask model */
            model?: (tendril.ModelParams.$Properties|null);

            /** RunTask particles */
            particles?: (number|null);

            /** RunTask recordsPerDecade */
            recordsPerDecade?: (number|null);

            /** RunTask checkpointIntervalSeconds */
            checkpointIntervalSeconds?: (number|null);

            /** RunTask checkpointEveryParticles */
            checkpointEveryParticles?: (number|null);

            /** RunTask engineVersion */
            engineVersion?: (string|null);

            /** RunTask keepPositions */
            keepPositions?: (boolean|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a RunTask. */
        type $Shape = {
          contractVersion?: number|null;
          ensembleId?: string|null;
          runIndex?: number|null;
          ensembleSeed?: string|null;
          model?: tendril.ModelParams.$Shape|null;
          particles?: number|null;
          recordsPerDecade?: number|null;
          checkpointIntervalSeconds?: number|null;
          checkpointEveryParticles?: number|null;
          engineVersion?: string|null;
          keepPositions?: boolean|null;
          $unknowns?: Uint8Array[];
        };
    }

    /**
     * Properties of a DoubleList.
     * @deprecated Use tendril.DoubleList.$Properties instead.
     */
    interface IDoubleList extends tendril.DoubleList.$Properties {
    }

    /** Represents a DoubleList. */
    class DoubleList {

        /**
         * Constructs a new DoubleList.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.DoubleList.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** DoubleList values. */
        values: number[];

        /**
         * Creates a new DoubleList instance using the specified properties.
         * @param [properties] Properties to set
         * @returns DoubleList instance
         */
        static create(properties: tendril.DoubleList.$Shape): tendril.DoubleList & tendril.DoubleList.$Shape;
        static create(properties?: tendril.DoubleList.$Properties): tendril.DoubleList;

        /**
         * Encodes the specified DoubleList message. Does not implicitly {@link tendril.DoubleList.verify|verify} messages.
         * @param message DoubleList message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.DoubleList.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified DoubleList message, length delimited. Does not implicitly {@link tendril.DoubleList.verify|verify} messages.
         * @param message DoubleList message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.DoubleList.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a DoubleList message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.DoubleList & tendril.DoubleList.$Shape} DoubleList
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.DoubleList & tendril.DoubleList.$Shape;

        /**
         * Decodes a DoubleList message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.DoubleList & tendril.DoubleList.$Shape} DoubleList
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.DoubleList & tendril.DoubleList.$Shape;

        /**
         * Verifies a DoubleList message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a DoubleList message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns DoubleList
         */
        static fromObject(object: { [k: string]: any }): tendril.DoubleList;

        /**
         * Creates a plain object from a DoubleList message. Also converts values to other types if specified.
         * @param message DoubleList
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.DoubleList, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this DoubleList to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for DoubleList
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace DoubleList {

        /** Properties of a DoubleList. */
        interface $Properties {

            /** DoubleList values */
            values?: (number[]|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a DoubleList. */
        type $Shape = tendril.DoubleList.$Properties;
    }

    /**
     * Properties of a GrowthSeries.
     * @deprecated Use tendril.GrowthSeries.$Properties instead.
     */
    interface IGrowthSeries extends tendril.GrowthSeries.$Properties {
    }

    /** Represents a GrowthSeries. */
    class GrowthSeries {

        /**
         * Constructs a new GrowthSeries.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.GrowthSeries.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** GrowthSeries sizes. */
        sizes: number[];

        /** GrowthSeries radiusOfGyration. */
        radiusOfGyration: number[];

        /** GrowthSeries maxRadius. */
        maxRadius: number[];

        /** GrowthSeries centerOffset. */
        centerOffset: number[];

        /** GrowthSeries extra. */
        extra: { [k: string]: tendril.DoubleList.$Properties };

        /**
         * Creates a new GrowthSeries instance using the specified properties.
         * @param [properties] Properties to set
         * @returns GrowthSeries instance
         */
        static create(properties: tendril.GrowthSeries.$Shape): tendril.GrowthSeries & tendril.GrowthSeries.$Shape;
        static create(properties?: tendril.GrowthSeries.$Properties): tendril.GrowthSeries;

        /**
         * Encodes the specified GrowthSeries message. Does not implicitly {@link tendril.GrowthSeries.verify|verify} messages.
         * @param message GrowthSeries message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.GrowthSeries.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified GrowthSeries message, length delimited. Does not implicitly {@link tendril.GrowthSeries.verify|verify} messages.
         * @param message GrowthSeries message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.GrowthSeries.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a GrowthSeries message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.GrowthSeries & tendril.GrowthSeries.$Shape} GrowthSeries
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.GrowthSeries & tendril.GrowthSeries.$Shape;

        /**
         * Decodes a GrowthSeries message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.GrowthSeries & tendril.GrowthSeries.$Shape} GrowthSeries
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.GrowthSeries & tendril.GrowthSeries.$Shape;

        /**
         * Verifies a GrowthSeries message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a GrowthSeries message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns GrowthSeries
         */
        static fromObject(object: { [k: string]: any }): tendril.GrowthSeries;

        /**
         * Creates a plain object from a GrowthSeries message. Also converts values to other types if specified.
         * @param message GrowthSeries
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.GrowthSeries, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this GrowthSeries to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for GrowthSeries
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace GrowthSeries {

        /** Properties of a GrowthSeries. */
        interface $Properties {

            /** GrowthSeries sizes */
            sizes?: (number[]|null);

            /** GrowthSeries radiusOfGyration */
            radiusOfGyration?: (number[]|null);

            /** GrowthSeries maxRadius */
            maxRadius?: (number[]|null);

            /** GrowthSeries centerOffset */
            centerOffset?: (number[]|null);

            /** GrowthSeries extra */
            extra?: ({ [k: string]: tendril.DoubleList.$Properties }|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a GrowthSeries. */
        type $Shape = tendril.GrowthSeries.$Properties;
    }

    /**
     * Properties of a MassRadius.
     * @deprecated Use tendril.MassRadius.$Properties instead.
     */
    interface IMassRadius extends tendril.MassRadius.$Properties {
    }

    /** Represents a MassRadius. */
    class MassRadius {

        /**
         * Constructs a new MassRadius.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.MassRadius.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** MassRadius radii. */
        radii: number[];

        /** MassRadius counts. */
        counts: number[];

        /**
         * Creates a new MassRadius instance using the specified properties.
         * @param [properties] Properties to set
         * @returns MassRadius instance
         */
        static create(properties: tendril.MassRadius.$Shape): tendril.MassRadius & tendril.MassRadius.$Shape;
        static create(properties?: tendril.MassRadius.$Properties): tendril.MassRadius;

        /**
         * Encodes the specified MassRadius message. Does not implicitly {@link tendril.MassRadius.verify|verify} messages.
         * @param message MassRadius message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.MassRadius.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified MassRadius message, length delimited. Does not implicitly {@link tendril.MassRadius.verify|verify} messages.
         * @param message MassRadius message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.MassRadius.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a MassRadius message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.MassRadius & tendril.MassRadius.$Shape} MassRadius
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.MassRadius & tendril.MassRadius.$Shape;

        /**
         * Decodes a MassRadius message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.MassRadius & tendril.MassRadius.$Shape} MassRadius
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.MassRadius & tendril.MassRadius.$Shape;

        /**
         * Verifies a MassRadius message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a MassRadius message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns MassRadius
         */
        static fromObject(object: { [k: string]: any }): tendril.MassRadius;

        /**
         * Creates a plain object from a MassRadius message. Also converts values to other types if specified.
         * @param message MassRadius
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.MassRadius, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this MassRadius to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for MassRadius
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace MassRadius {

        /** Properties of a MassRadius. */
        interface $Properties {

            /** MassRadius radii */
            radii?: (number[]|null);

            /** MassRadius counts */
            counts?: (number[]|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a MassRadius. */
        type $Shape = tendril.MassRadius.$Properties;
    }

    /**
     * Properties of a GrowthCounters.
     * @deprecated Use tendril.GrowthCounters.$Properties instead.
     */
    interface IGrowthCounters extends tendril.GrowthCounters.$Properties {
    }

    /** Represents a GrowthCounters. */
    class GrowthCounters {

        /**
         * Constructs a new GrowthCounters.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.GrowthCounters.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** GrowthCounters jumps. */
        jumps: number;

        /** GrowthCounters shortSteps. */
        shortSteps: number;

        /** GrowthCounters returns. */
        returns: number;

        /**
         * Creates a new GrowthCounters instance using the specified properties.
         * @param [properties] Properties to set
         * @returns GrowthCounters instance
         */
        static create(properties: tendril.GrowthCounters.$Shape): tendril.GrowthCounters & tendril.GrowthCounters.$Shape;
        static create(properties?: tendril.GrowthCounters.$Properties): tendril.GrowthCounters;

        /**
         * Encodes the specified GrowthCounters message. Does not implicitly {@link tendril.GrowthCounters.verify|verify} messages.
         * @param message GrowthCounters message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.GrowthCounters.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified GrowthCounters message, length delimited. Does not implicitly {@link tendril.GrowthCounters.verify|verify} messages.
         * @param message GrowthCounters message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.GrowthCounters.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a GrowthCounters message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.GrowthCounters & tendril.GrowthCounters.$Shape} GrowthCounters
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.GrowthCounters & tendril.GrowthCounters.$Shape;

        /**
         * Decodes a GrowthCounters message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.GrowthCounters & tendril.GrowthCounters.$Shape} GrowthCounters
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.GrowthCounters & tendril.GrowthCounters.$Shape;

        /**
         * Verifies a GrowthCounters message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a GrowthCounters message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns GrowthCounters
         */
        static fromObject(object: { [k: string]: any }): tendril.GrowthCounters;

        /**
         * Creates a plain object from a GrowthCounters message. Also converts values to other types if specified.
         * @param message GrowthCounters
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.GrowthCounters, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this GrowthCounters to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for GrowthCounters
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace GrowthCounters {

        /** Properties of a GrowthCounters. */
        interface $Properties {

            /** GrowthCounters jumps */
            jumps?: (number|null);

            /** GrowthCounters shortSteps */
            shortSteps?: (number|null);

            /** GrowthCounters returns */
            returns?: (number|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a GrowthCounters. */
        type $Shape = tendril.GrowthCounters.$Properties;
    }

    /**
     * Properties of a RunTimings.
     * @deprecated Use tendril.RunTimings.$Properties instead.
     */
    interface IRunTimings extends tendril.RunTimings.$Properties {
    }

    /** Represents a RunTimings. */
    class RunTimings {

        /**
         * Constructs a new RunTimings.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.RunTimings.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** RunTimings growSeconds. */
        growSeconds: number;

        /** RunTimings startedAtMs. */
        startedAtMs: number;

        /** RunTimings finishedAtMs. */
        finishedAtMs: number;

        /** RunTimings resumes. */
        resumes: number;

        /** RunTimings finishedBy. */
        finishedBy: string;

        /**
         * Creates a new RunTimings instance using the specified properties.
         * @param [properties] Properties to set
         * @returns RunTimings instance
         */
        static create(properties: tendril.RunTimings.$Shape): tendril.RunTimings & tendril.RunTimings.$Shape;
        static create(properties?: tendril.RunTimings.$Properties): tendril.RunTimings;

        /**
         * Encodes the specified RunTimings message. Does not implicitly {@link tendril.RunTimings.verify|verify} messages.
         * @param message RunTimings message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.RunTimings.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified RunTimings message, length delimited. Does not implicitly {@link tendril.RunTimings.verify|verify} messages.
         * @param message RunTimings message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.RunTimings.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a RunTimings message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.RunTimings & tendril.RunTimings.$Shape} RunTimings
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.RunTimings & tendril.RunTimings.$Shape;

        /**
         * Decodes a RunTimings message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.RunTimings & tendril.RunTimings.$Shape} RunTimings
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.RunTimings & tendril.RunTimings.$Shape;

        /**
         * Verifies a RunTimings message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a RunTimings message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns RunTimings
         */
        static fromObject(object: { [k: string]: any }): tendril.RunTimings;

        /**
         * Creates a plain object from a RunTimings message. Also converts values to other types if specified.
         * @param message RunTimings
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.RunTimings, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this RunTimings to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for RunTimings
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace RunTimings {

        /** Properties of a RunTimings. */
        interface $Properties {

            /** RunTimings growSeconds */
            growSeconds?: (number|null);

            /** RunTimings startedAtMs */
            startedAtMs?: (number|null);

            /** RunTimings finishedAtMs */
            finishedAtMs?: (number|null);

            /** RunTimings resumes */
            resumes?: (number|null);

            /** RunTimings finishedBy */
            finishedBy?: (string|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a RunTimings. */
        type $Shape = tendril.RunTimings.$Properties;
    }

    /**
     * Properties of a RunResult.
     * @deprecated Use tendril.RunResult.$Properties instead.
     */
    interface IRunResult extends tendril.RunResult.$Properties {
    }

    /** Represents a RunResult. */
    class RunResult {

        /**
         * Constructs a new RunResult.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.RunResult.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** RunResult contractVersion. */
        contractVersion: number;

        /** RunResult ensembleId. */
        ensembleId: string;

        /** RunResult runIndex. */
        runIndex: number;

        /** RunResult engineVersion. */
        engineVersion: string;

        /** RunResult model. */
        model?: (tendril.ModelParams.$Properties|null);

        /** RunResult particles. */
        particles: number;

        /** RunResult ensembleSeed. */
        ensembleSeed: string;

        /** RunResult series. */
        series?: (tendril.GrowthSeries.$Properties|null);

        /** RunResult massRadius. */
        massRadius?: (tendril.MassRadius.$Properties|null);

        /** RunResult counters. */
        counters?: (tendril.GrowthCounters.$Properties|null);

        /** RunResult stateHash. */
        stateHash: string;

        /** RunResult timings. */
        timings?: (tendril.RunTimings.$Properties|null);

        /** RunResult counterValues. */
        counterValues: { [k: string]: number };

        /** RunResult dimension. */
        dimension: number;

        /**
         * Creates a new RunResult instance using the specified properties.
         * @param [properties] Properties to set
         * @returns RunResult instance
         */
        static create(properties: tendril.RunResult.$Shape): tendril.RunResult & tendril.RunResult.$Shape;
        static create(properties?: tendril.RunResult.$Properties): tendril.RunResult;

        /**
         * Encodes the specified RunResult message. Does not implicitly {@link tendril.RunResult.verify|verify} messages.
         * @param message RunResult message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.RunResult.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified RunResult message, length delimited. Does not implicitly {@link tendril.RunResult.verify|verify} messages.
         * @param message RunResult message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.RunResult.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a RunResult message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.RunResult & tendril.RunResult.$Shape} RunResult
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.RunResult & tendril.RunResult.$Shape;

        /**
         * Decodes a RunResult message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.RunResult & tendril.RunResult.$Shape} RunResult
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.RunResult & tendril.RunResult.$Shape;

        /**
         * Verifies a RunResult message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a RunResult message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns RunResult
         */
        static fromObject(object: { [k: string]: any }): tendril.RunResult;

        /**
         * Creates a plain object from a RunResult message. Also converts values to other types if specified.
         * @param message RunResult
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.RunResult, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this RunResult to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for RunResult
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace RunResult {

        /** Properties of a RunResult. */
        interface $Properties {

            /** RunResult contractVersion */
            contractVersion?: (number|null);

            /** RunResult ensembleId */
            ensembleId?: (string|null);

            /** RunResult runIndex */
            runIndex?: (number|null);

            /** RunResult engineVersion */
            engineVersion?: (string|null);

            /** RunResult model */
            model?: (tendril.ModelParams.$Properties|null);

            /** RunResult particles */
            particles?: (number|null);

            /** RunResult ensembleSeed */
            ensembleSeed?: (string|null);

            /** RunResult series */
            series?: (tendril.GrowthSeries.$Properties|null);

            /** RunResult massRadius */
            massRadius?: (tendril.MassRadius.$Properties|null);

            /** RunResult counters */
            counters?: (tendril.GrowthCounters.$Properties|null);

            /** RunResult stateHash */
            stateHash?: (string|null);

            /** RunResult timings */
            timings?: (tendril.RunTimings.$Properties|null);

            /** RunResult counterValues */
            counterValues?: ({ [k: string]: number }|null);

            /** RunResult dimension */
            dimension?: (number|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a RunResult. */
        type $Shape = {
          contractVersion?: number|null;
          ensembleId?: string|null;
          runIndex?: number|null;
          engineVersion?: string|null;
          model?: tendril.ModelParams.$Shape|null;
          particles?: number|null;
          ensembleSeed?: string|null;
          series?: tendril.GrowthSeries.$Shape|null;
          massRadius?: tendril.MassRadius.$Shape|null;
          counters?: tendril.GrowthCounters.$Shape|null;
          stateHash?: string|null;
          timings?: tendril.RunTimings.$Shape|null;
          counterValues?: { [k: string]: number }|null;
          dimension?: number|null;
          $unknowns?: Uint8Array[];
        };
    }

    /**
     * Properties of a Checkpoint.
     * @deprecated Use tendril.Checkpoint.$Properties instead.
     */
    interface ICheckpoint extends tendril.Checkpoint.$Properties {
    }

    /** Represents a Checkpoint. */
    class Checkpoint {

        /**
         * Constructs a new Checkpoint.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.Checkpoint.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** Checkpoint contractVersion. */
        contractVersion: number;

        /** Checkpoint engineVersion. */
        engineVersion: string;

        /** Checkpoint task. */
        task?: (tendril.RunTask.$Properties|null);

        /** Checkpoint count. */
        count: number;

        /** Checkpoint x. */
        x: Uint8Array;

        /** Checkpoint y. */
        y: Uint8Array;

        /** Checkpoint rngState. */
        rngState: number[];

        /** Checkpoint counters. */
        counters?: (tendril.GrowthCounters.$Properties|null);

        /** Checkpoint series. */
        series?: (tendril.GrowthSeries.$Properties|null);

        /** Checkpoint growSeconds. */
        growSeconds: number;

        /** Checkpoint startedAtMs. */
        startedAtMs: number;

        /** Checkpoint resumes. */
        resumes: number;

        /** Checkpoint dimension. */
        dimension: number;

        /** Checkpoint positions. */
        positions: Uint8Array;

        /** Checkpoint counterValues. */
        counterValues: { [k: string]: number };

        /** Checkpoint modelState. */
        modelState: Uint8Array;

        /**
         * Creates a new Checkpoint instance using the specified properties.
         * @param [properties] Properties to set
         * @returns Checkpoint instance
         */
        static create(properties: tendril.Checkpoint.$Shape): tendril.Checkpoint & tendril.Checkpoint.$Shape;
        static create(properties?: tendril.Checkpoint.$Properties): tendril.Checkpoint;

        /**
         * Encodes the specified Checkpoint message. Does not implicitly {@link tendril.Checkpoint.verify|verify} messages.
         * @param message Checkpoint message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.Checkpoint.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified Checkpoint message, length delimited. Does not implicitly {@link tendril.Checkpoint.verify|verify} messages.
         * @param message Checkpoint message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.Checkpoint.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a Checkpoint message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.Checkpoint & tendril.Checkpoint.$Shape} Checkpoint
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.Checkpoint & tendril.Checkpoint.$Shape;

        /**
         * Decodes a Checkpoint message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.Checkpoint & tendril.Checkpoint.$Shape} Checkpoint
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.Checkpoint & tendril.Checkpoint.$Shape;

        /**
         * Verifies a Checkpoint message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a Checkpoint message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns Checkpoint
         */
        static fromObject(object: { [k: string]: any }): tendril.Checkpoint;

        /**
         * Creates a plain object from a Checkpoint message. Also converts values to other types if specified.
         * @param message Checkpoint
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.Checkpoint, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this Checkpoint to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for Checkpoint
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace Checkpoint {

        /** Properties of a Checkpoint. */
        interface $Properties {

            /** Checkpoint contractVersion */
            contractVersion?: (number|null);

            /** Checkpoint engineVersion */
            engineVersion?: (string|null);

            /** Checkpoint task */
            task?: (tendril.RunTask.$Properties|null);

            /** Checkpoint count */
            count?: (number|null);

            /** Checkpoint x */
            x?: (Uint8Array|null);

            /** Checkpoint y */
            y?: (Uint8Array|null);

            /** Checkpoint rngState */
            rngState?: (number[]|null);

            /** Checkpoint counters */
            counters?: (tendril.GrowthCounters.$Properties|null);

            /** Checkpoint series */
            series?: (tendril.GrowthSeries.$Properties|null);

            /** Checkpoint growSeconds */
            growSeconds?: (number|null);

            /** Checkpoint startedAtMs */
            startedAtMs?: (number|null);

            /** Checkpoint resumes */
            resumes?: (number|null);

            /** Checkpoint dimension */
            dimension?: (number|null);

            /** Checkpoint positions */
            positions?: (Uint8Array|null);

            /** Checkpoint counterValues */
            counterValues?: ({ [k: string]: number }|null);

            /** Checkpoint modelState */
            modelState?: (Uint8Array|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a Checkpoint. */
        type $Shape = {
          contractVersion?: number|null;
          engineVersion?: string|null;
          task?: tendril.RunTask.$Shape|null;
          count?: number|null;
          x?: Uint8Array|null;
          y?: Uint8Array|null;
          rngState?: number[]|null;
          counters?: tendril.GrowthCounters.$Shape|null;
          series?: tendril.GrowthSeries.$Shape|null;
          growSeconds?: number|null;
          startedAtMs?: number|null;
          resumes?: number|null;
          dimension?: number|null;
          positions?: Uint8Array|null;
          counterValues?: { [k: string]: number }|null;
          modelState?: Uint8Array|null;
          $unknowns?: Uint8Array[];
        };
    }

    /**
     * Properties of a PowerLawFit.
     * @deprecated Use tendril.PowerLawFit.$Properties instead.
     */
    interface IPowerLawFit extends tendril.PowerLawFit.$Properties {
    }

    /** Represents a PowerLawFit. */
    class PowerLawFit {

        /**
         * Constructs a new PowerLawFit.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.PowerLawFit.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** PowerLawFit exponent. */
        exponent: number;

        /** PowerLawFit prefactor. */
        prefactor: number;

        /** PowerLawFit rSquared. */
        rSquared: number;

        /** PowerLawFit points. */
        points: number;

        /** PowerLawFit minX. */
        minX: number;

        /** PowerLawFit maxX. */
        maxX: number;

        /**
         * Creates a new PowerLawFit instance using the specified properties.
         * @param [properties] Properties to set
         * @returns PowerLawFit instance
         */
        static create(properties: tendril.PowerLawFit.$Shape): tendril.PowerLawFit & tendril.PowerLawFit.$Shape;
        static create(properties?: tendril.PowerLawFit.$Properties): tendril.PowerLawFit;

        /**
         * Encodes the specified PowerLawFit message. Does not implicitly {@link tendril.PowerLawFit.verify|verify} messages.
         * @param message PowerLawFit message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.PowerLawFit.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified PowerLawFit message, length delimited. Does not implicitly {@link tendril.PowerLawFit.verify|verify} messages.
         * @param message PowerLawFit message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.PowerLawFit.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes a PowerLawFit message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.PowerLawFit & tendril.PowerLawFit.$Shape} PowerLawFit
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.PowerLawFit & tendril.PowerLawFit.$Shape;

        /**
         * Decodes a PowerLawFit message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.PowerLawFit & tendril.PowerLawFit.$Shape} PowerLawFit
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.PowerLawFit & tendril.PowerLawFit.$Shape;

        /**
         * Verifies a PowerLawFit message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates a PowerLawFit message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns PowerLawFit
         */
        static fromObject(object: { [k: string]: any }): tendril.PowerLawFit;

        /**
         * Creates a plain object from a PowerLawFit message. Also converts values to other types if specified.
         * @param message PowerLawFit
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.PowerLawFit, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this PowerLawFit to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for PowerLawFit
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace PowerLawFit {

        /** Properties of a PowerLawFit. */
        interface $Properties {

            /** PowerLawFit exponent */
            exponent?: (number|null);

            /** PowerLawFit prefactor */
            prefactor?: (number|null);

            /** PowerLawFit rSquared */
            rSquared?: (number|null);

            /** PowerLawFit points */
            points?: (number|null);

            /** PowerLawFit minX */
            minX?: (number|null);

            /** PowerLawFit maxX */
            maxX?: (number|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of a PowerLawFit. */
        type $Shape = tendril.PowerLawFit.$Properties;
    }

    /**
     * Properties of an EnsembleSummary.
     * @deprecated Use tendril.EnsembleSummary.$Properties instead.
     */
    interface IEnsembleSummary extends tendril.EnsembleSummary.$Properties {
    }

    /** Represents an EnsembleSummary. */
    class EnsembleSummary {

        /**
         * Constructs a new EnsembleSummary.
         * @param [properties] Properties to set
         */
        constructor(properties?: tendril.EnsembleSummary.$Properties);

        /** Unknown fields preserved while decoding when enabled */
        $unknowns?: Uint8Array[];

        /** EnsembleSummary contractVersion. */
        contractVersion: number;

        /** EnsembleSummary ensembleId. */
        ensembleId: string;

        /** EnsembleSummary name. */
        name: string;

        /** EnsembleSummary engineVersion. */
        engineVersion: string;

        /** EnsembleSummary specJson. */
        specJson: string;

        /** EnsembleSummary clustersPlanned. */
        clustersPlanned: number;

        /** EnsembleSummary clustersDone. */
        clustersDone: number;

        /** EnsembleSummary runs. */
        runs: tendril.RunResult.$Properties[];

        /** EnsembleSummary radiusOfGyrationFit. */
        radiusOfGyrationFit?: (tendril.PowerLawFit.$Properties|null);

        /** EnsembleSummary fractalDimension. */
        fractalDimension: number;

        /** EnsembleSummary createdAtMs. */
        createdAtMs: number;

        /** EnsembleSummary meanSizes. */
        meanSizes: number[];

        /** EnsembleSummary meanLogRadiusOfGyration. */
        meanLogRadiusOfGyration: number[];

        /** EnsembleSummary statisticsJson. */
        statisticsJson: string;

        /** EnsembleSummary partial. */
        partial: boolean;

        /** EnsembleSummary adaptiveJson. */
        adaptiveJson: string;

        /**
         * Creates a new EnsembleSummary instance using the specified properties.
         * @param [properties] Properties to set
         * @returns EnsembleSummary instance
         */
        static create(properties: tendril.EnsembleSummary.$Shape): tendril.EnsembleSummary & tendril.EnsembleSummary.$Shape;
        static create(properties?: tendril.EnsembleSummary.$Properties): tendril.EnsembleSummary;

        /**
         * Encodes the specified EnsembleSummary message. Does not implicitly {@link tendril.EnsembleSummary.verify|verify} messages.
         * @param message EnsembleSummary message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encode(message: tendril.EnsembleSummary.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Encodes the specified EnsembleSummary message, length delimited. Does not implicitly {@link tendril.EnsembleSummary.verify|verify} messages.
         * @param message EnsembleSummary message or plain object to encode
         * @param [writer] Writer to encode to
         * @returns Writer
         */
        static encodeDelimited(message: tendril.EnsembleSummary.$Properties, writer?: $protobuf.Writer): $protobuf.Writer;

        /**
         * Decodes an EnsembleSummary message from the specified reader or buffer.
         * @param reader Reader or buffer to decode from
         * @param [length] Message length if known beforehand
         * @returns {tendril.EnsembleSummary & tendril.EnsembleSummary.$Shape} EnsembleSummary
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decode(reader: ($protobuf.Reader|Uint8Array), length?: number): tendril.EnsembleSummary & tendril.EnsembleSummary.$Shape;

        /**
         * Decodes an EnsembleSummary message from the specified reader or buffer, length delimited.
         * @param reader Reader or buffer to decode from
         * @returns {tendril.EnsembleSummary & tendril.EnsembleSummary.$Shape} EnsembleSummary
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        static decodeDelimited(reader: ($protobuf.Reader|Uint8Array)): tendril.EnsembleSummary & tendril.EnsembleSummary.$Shape;

        /**
         * Verifies an EnsembleSummary message.
         * @param message Plain object to verify
         * @returns `null` if valid, otherwise the reason why it is not
         */
        static verify(message: { [k: string]: any }): (string|null);

        /**
         * Creates an EnsembleSummary message from a plain object. Also converts values to their respective internal types.
         * @param object Plain object
         * @returns EnsembleSummary
         */
        static fromObject(object: { [k: string]: any }): tendril.EnsembleSummary;

        /**
         * Creates a plain object from an EnsembleSummary message. Also converts values to other types if specified.
         * @param message EnsembleSummary
         * @param [options] Conversion options
         * @returns Plain object
         */
        static toObject(message: tendril.EnsembleSummary, options?: $protobuf.IConversionOptions): { [k: string]: any };

        /**
         * Converts this EnsembleSummary to JSON.
         * @returns JSON object
         */
        toJSON(): { [k: string]: any };

        /**
         * Gets the type url for EnsembleSummary
         * @param [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns The type url
         */
        static getTypeUrl(prefix?: string): string;
    }

    namespace EnsembleSummary {

        /** Properties of an EnsembleSummary. */
        interface $Properties {

            /** EnsembleSummary contractVersion */
            contractVersion?: (number|null);

            /** EnsembleSummary ensembleId */
            ensembleId?: (string|null);

            /** EnsembleSummary name */
            name?: (string|null);

            /** EnsembleSummary engineVersion */
            engineVersion?: (string|null);

            /** EnsembleSummary specJson */
            specJson?: (string|null);

            /** EnsembleSummary clustersPlanned */
            clustersPlanned?: (number|null);

            /** EnsembleSummary clustersDone */
            clustersDone?: (number|null);

            /** EnsembleSummary runs */
            runs?: (tendril.RunResult.$Properties[]|null);

            /** EnsembleSummary radiusOfGyrationFit */
            radiusOfGyrationFit?: (tendril.PowerLawFit.$Properties|null);

            /** EnsembleSummary fractalDimension */
            fractalDimension?: (number|null);

            /** EnsembleSummary createdAtMs */
            createdAtMs?: (number|null);

            /** EnsembleSummary meanSizes */
            meanSizes?: (number[]|null);

            /** EnsembleSummary meanLogRadiusOfGyration */
            meanLogRadiusOfGyration?: (number[]|null);

            /** EnsembleSummary statisticsJson */
            statisticsJson?: (string|null);

            /** EnsembleSummary partial */
            partial?: (boolean|null);

            /** EnsembleSummary adaptiveJson */
            adaptiveJson?: (string|null);

            /** Unknown fields preserved while decoding when enabled */
            $unknowns?: Uint8Array[];
        }

        /** Shape of an EnsembleSummary. */
        type $Shape = {
          contractVersion?: number|null;
          ensembleId?: string|null;
          name?: string|null;
          engineVersion?: string|null;
          specJson?: string|null;
          clustersPlanned?: number|null;
          clustersDone?: number|null;
          runs?: tendril.RunResult.$Shape[]|null;
          radiusOfGyrationFit?: tendril.PowerLawFit.$Shape|null;
          fractalDimension?: number|null;
          createdAtMs?: number|null;
          meanSizes?: number[]|null;
          meanLogRadiusOfGyration?: number[]|null;
          statisticsJson?: string|null;
          partial?: boolean|null;
          adaptiveJson?: string|null;
          $unknowns?: Uint8Array[];
        };
    }
}
