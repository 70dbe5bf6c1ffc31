/*eslint-disable block-scoped-var, id-length, no-control-regex, no-magic-numbers, no-mixed-operators, no-prototype-builtins, no-redeclare, no-shadow, no-var, sort-vars, default-case, jsdoc/require-param*/
import $protobuf from "protobufjs/minimal.js";

// Common aliases
const $Reader = $protobuf.Reader, $Writer = $protobuf.Writer, $util = $protobuf.util;
const $Object = $util.global.Object, $undefined = $util.global.undefined, $Error = $util.global.Error, $RangeError = $util.global.RangeError, $TypeError = $util.global.TypeError, $Number = $util.global.Number, $isFinite = $util.global.isFinite, $String = $util.global.String, $Boolean = $util.global.Boolean, $Array = $util.global.Array;

// Exported root namespace
const $root = $protobuf.roots["default"] || ($protobuf.roots["default"] = {});

export const tendril = $root.tendril = (() => {

    /**
     * Namespace tendril.
     * @exports tendril
     * @namespace
     */
    const tendril = {};

    tendril.OffLatticeDla2dParams = (function() {

        /**
         * Properties of an OffLatticeDla2dParams.
         * @typedef {Object} tendril.OffLatticeDla2dParams.$Properties
         * @property {number|null} [minStep] OffLatticeDla2dParams minStep
         * @property {number|null} [launchMargin] OffLatticeDla2dParams launchMargin
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of an OffLatticeDla2dParams.
         * @memberof tendril
         * @interface IOffLatticeDla2dParams
         * @augments tendril.OffLatticeDla2dParams.$Properties
         * @deprecated Use tendril.OffLatticeDla2dParams.$Properties instead.
         */

        /**
         * Shape of an OffLatticeDla2dParams.
         * @typedef {tendril.OffLatticeDla2dParams.$Properties} tendril.OffLatticeDla2dParams.$Shape
         */

        /**
         * Constructs a new OffLatticeDla2dParams.
         * @memberof tendril
         * @classdesc Represents an OffLatticeDla2dParams.
         * @constructor
         * @param {tendril.OffLatticeDla2dParams.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const OffLatticeDla2dParams = function (properties) {
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * OffLatticeDla2dParams minStep.
         * @member {number} minStep
         * @memberof tendril.OffLatticeDla2dParams
         * @instance
         */
        OffLatticeDla2dParams.prototype.minStep = 0;

        /**
         * OffLatticeDla2dParams launchMargin.
         * @member {number} launchMargin
         * @memberof tendril.OffLatticeDla2dParams
         * @instance
         */
        OffLatticeDla2dParams.prototype.launchMargin = 0;

        /**
         * Creates a new OffLatticeDla2dParams instance using the specified properties.
         * @function create
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {tendril.OffLatticeDla2dParams.$Properties=} [properties] Properties to set
         * @returns {tendril.OffLatticeDla2dParams} OffLatticeDla2dParams instance
         * @type {{
         *   (properties: tendril.OffLatticeDla2dParams.$Shape): tendril.OffLatticeDla2dParams & tendril.OffLatticeDla2dParams.$Shape;
         *   (properties?: tendril.OffLatticeDla2dParams.$Properties): tendril.OffLatticeDla2dParams;
         * }}
         */
        OffLatticeDla2dParams.create = function(properties) {
            return new OffLatticeDla2dParams(properties);
        };

        /**
         * Encodes the specified OffLatticeDla2dParams message. Does not implicitly {@link tendril.OffLatticeDla2dParams.verify|verify} messages.
         * @function encode
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {tendril.OffLatticeDla2dParams.$Properties} message OffLatticeDla2dParams message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        OffLatticeDla2dParams.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.minStep != null && $Object.hasOwnProperty.call(message, "minStep") && !$Object.is(message.minStep, 0))
                writer.uint32(/* id 1, wireType 1 =*/9).double(message.minStep);
            if (message.launchMargin != null && $Object.hasOwnProperty.call(message, "launchMargin") && !$Object.is(message.launchMargin, 0))
                writer.uint32(/* id 2, wireType 1 =*/17).double(message.launchMargin);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified OffLatticeDla2dParams message, length delimited. Does not implicitly {@link tendril.OffLatticeDla2dParams.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {tendril.OffLatticeDla2dParams.$Properties} message OffLatticeDla2dParams message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        OffLatticeDla2dParams.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes an OffLatticeDla2dParams message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.OffLatticeDla2dParams & tendril.OffLatticeDla2dParams.$Shape} OffLatticeDla2dParams
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        OffLatticeDla2dParams.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.OffLatticeDla2dParams();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.minStep = value;
                        else
                            delete message.minStep;
                        continue;
                    }
                case 2: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.launchMargin = value;
                        else
                            delete message.launchMargin;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes an OffLatticeDla2dParams message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.OffLatticeDla2dParams & tendril.OffLatticeDla2dParams.$Shape} OffLatticeDla2dParams
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        OffLatticeDla2dParams.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies an OffLatticeDla2dParams message.
         * @function verify
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        OffLatticeDla2dParams.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.minStep != null && $Object.hasOwnProperty.call(message, "minStep"))
                if (typeof message.minStep !== "number")
                    return "minStep: number expected";
            if (message.launchMargin != null && $Object.hasOwnProperty.call(message, "launchMargin"))
                if (typeof message.launchMargin !== "number")
                    return "launchMargin: number expected";
            return null;
        };

        /**
         * Creates an OffLatticeDla2dParams message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.OffLatticeDla2dParams} OffLatticeDla2dParams
         */
        OffLatticeDla2dParams.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.OffLatticeDla2dParams)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.OffLatticeDla2dParams: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.OffLatticeDla2dParams();
            if (object.minStep != null)
                if (!$Object.is($Number(object.minStep), 0))
                    message.minStep = $Number(object.minStep);
            if (object.launchMargin != null)
                if (!$Object.is($Number(object.launchMargin), 0))
                    message.launchMargin = $Number(object.launchMargin);
            return message;
        };

        /**
         * Creates a plain object from an OffLatticeDla2dParams message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {tendril.OffLatticeDla2dParams} message OffLatticeDla2dParams
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        OffLatticeDla2dParams.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.defaults) {
                object.minStep = 0;
                object.launchMargin = 0;
            }
            if (message.minStep != null && $Object.hasOwnProperty.call(message, "minStep"))
                object.minStep = options.json && !$isFinite(message.minStep) ? $String(message.minStep) : message.minStep;
            if (message.launchMargin != null && $Object.hasOwnProperty.call(message, "launchMargin"))
                object.launchMargin = options.json && !$isFinite(message.launchMargin) ? $String(message.launchMargin) : message.launchMargin;
            return object;
        };

        /**
         * Converts this OffLatticeDla2dParams to JSON.
         * @function toJSON
         * @memberof tendril.OffLatticeDla2dParams
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        OffLatticeDla2dParams.prototype.toJSON = function() {
            return OffLatticeDla2dParams.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for OffLatticeDla2dParams
         * @function getTypeUrl
         * @memberof tendril.OffLatticeDla2dParams
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        OffLatticeDla2dParams.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.OffLatticeDla2dParams";
        };

        return OffLatticeDla2dParams;
    })();

    tendril.ModelParams = (function() {

        /**
         * Properties of a ModelParams.
         * @typedef {Object} tendril.ModelParams.$Properties
         * @property {tendril.OffLatticeDla2dParams.$Properties|null} [offlatticeDla2d] ModelParams offlatticeDla2d
         * @property {string|null} [kind] ModelParams kind
         * @property {Object.<string,number>|null} [params] ModelParams params
         * @property {"offlatticeDla2d"} [legacy] ModelParams legacy
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a ModelParams.
         * @memberof tendril
         * @interface IModelParams
         * @augments tendril.ModelParams.$Properties
         * @deprecated Use tendril.ModelParams.$Properties instead.
         */

        /**
         * Narrowed shape of a ModelParams.
         * @typedef {{
         *   offlatticeDla2d?: tendril.OffLatticeDla2dParams.$Shape|null;
         *   kind?: string|null;
         *   params?: Object.<string,number>|null;
         *   $unknowns?: Array.<Uint8Array>;
         * } & (
         *   ({ legacy?: undefined; offlatticeDla2d?: null }|{ legacy?: "offlatticeDla2d"; offlatticeDla2d: tendril.OffLatticeDla2dParams.$Shape })
         * )} tendril.ModelParams.$Shape
         */

        /**
         * Constructs a new ModelParams.
         * @memberof tendril
         * @classdesc Represents a ModelParams.
         * @constructor
         * @param {tendril.ModelParams.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const ModelParams = function (properties) {
            this.params = {};
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * ModelParams offlatticeDla2d.
         * @member {tendril.OffLatticeDla2dParams.$Properties|null|undefined} offlatticeDla2d
         * @memberof tendril.ModelParams
         * @instance
         */
        ModelParams.prototype.offlatticeDla2d = null;

        /**
         * ModelParams kind.
         * @member {string} kind
         * @memberof tendril.ModelParams
         * @instance
         */
        ModelParams.prototype.kind = "";

        /**
         * ModelParams params.
         * @member {Object.<string,number>} params
         * @memberof tendril.ModelParams
         * @instance
         */
        ModelParams.prototype.params = $util.emptyObject;

        // OneOf field names bound to virtual getters and setters
        let $oneOfFields;

        /**
         * ModelParams legacy.
         * @member {"offlatticeDla2d"|undefined} legacy
         * @memberof tendril.ModelParams
         * @instance
         */
        $Object.defineProperty(ModelParams.prototype, "legacy", {
            get: $util.oneOfGetter($oneOfFields = ["offlatticeDla2d"]),
            set: $util.oneOfSetter($oneOfFields)
        });

        /**
         * Creates a new ModelParams instance using the specified properties.
         * @function create
         * @memberof tendril.ModelParams
         * @static
         * @param {tendril.ModelParams.$Properties=} [properties] Properties to set
         * @returns {tendril.ModelParams} ModelParams instance
         * @type {{
         *   (properties: tendril.ModelParams.$Shape): tendril.ModelParams & tendril.ModelParams.$Shape;
         *   (properties?: tendril.ModelParams.$Properties): tendril.ModelParams;
         * }}
         */
        ModelParams.create = function(properties) {
            return new ModelParams(properties);
        };

        /**
         * Encodes the specified ModelParams message. Does not implicitly {@link tendril.ModelParams.verify|verify} messages.
         * @function encode
         * @memberof tendril.ModelParams
         * @static
         * @param {tendril.ModelParams.$Properties} message ModelParams message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        ModelParams.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.offlatticeDla2d != null && $Object.hasOwnProperty.call(message, "offlatticeDla2d"))
                $root.tendril.OffLatticeDla2dParams.encode(message.offlatticeDla2d, writer.uint32(/* id 1, wireType 2 =*/10).fork(), _depth + 1).ldelim();
            if (message.kind != null && $Object.hasOwnProperty.call(message, "kind") && message.kind !== "")
                writer.uint32(/* id 2, wireType 2 =*/18).string(message.kind);
            if (message.params != null && $Object.hasOwnProperty.call(message, "params"))
                for (let keys = $Object.keys(message.params), i = 0; i < keys.length; ++i)
                    writer.uint32(/* id 3, wireType 2 =*/26).fork().uint32(/* id 1, wireType 2 =*/10).string(keys[i]).uint32(/* id 2, wireType 1 =*/17).double(message.params[keys[i]]).ldelim();
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified ModelParams message, length delimited. Does not implicitly {@link tendril.ModelParams.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.ModelParams
         * @static
         * @param {tendril.ModelParams.$Properties} message ModelParams message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        ModelParams.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a ModelParams message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.ModelParams
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.ModelParams & tendril.ModelParams.$Shape} ModelParams
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        ModelParams.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, key, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.ModelParams();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 2)
                            break;
                        message.offlatticeDla2d = $root.tendril.OffLatticeDla2dParams.decode(reader, reader.size(), $undefined, _depth + 1, message.offlatticeDla2d);
                        message.legacy = "offlatticeDla2d";
                        continue;
                    }
                case 2: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.kind = value;
                        else
                            delete message.kind;
                        continue;
                    }
                case 3: {
                        if (wireType !== 2)
                            break;
                        if (message.params === $util.emptyObject)
                            message.params = {};
                        let end2 = reader.size() + reader.pos;
                        if (end2 > reader.len)
                            throw $RangeError("index out of range");
                        reader.len = end2;
                        key = "";
                        value = 0;
                        while (reader.pos < end2) {
                            let tag2 = reader.tag();
                            wireType = tag2 & 7;
                            switch (tag2 >>>= 3) {
                            case 1:
                                if (wireType !== 2)
                                    break;
                                key = reader.stringVerify();
                                continue;
                            case 2:
                                if (wireType !== 1)
                                    break;
                                value = reader.double();
                                continue;
                            }
                            reader.skipType(wireType, _depth, tag2);
                        }
                        if (reader.pos !== end2)
                            throw $RangeError("index out of range");
                        reader.len = end;
                        if (key === "__proto__")
                            $util.makeProp(message.params, key);
                        message.params[key] = value;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a ModelParams message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.ModelParams
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.ModelParams & tendril.ModelParams.$Shape} ModelParams
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        ModelParams.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a ModelParams message.
         * @function verify
         * @memberof tendril.ModelParams
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        ModelParams.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            let properties = {};
            if (message.offlatticeDla2d != null && $Object.hasOwnProperty.call(message, "offlatticeDla2d")) {
                properties.legacy = 1;
                {
                    let error = $root.tendril.OffLatticeDla2dParams.verify(message.offlatticeDla2d, _depth + 1);
                    if (error)
                        return "offlatticeDla2d." + error;
                }
            }
            if (message.kind != null && $Object.hasOwnProperty.call(message, "kind"))
                if (!$util.isString(message.kind))
                    return "kind: string expected";
            if (message.params != null && $Object.hasOwnProperty.call(message, "params")) {
                if (!$util.isObject(message.params))
                    return "params: object expected";
                let key = $Object.keys(message.params);
                for (let i = 0; i < key.length; ++i)
                    if (typeof message.params[key[i]] !== "number")
                        return "params: number{k:string} expected";
            }
            return null;
        };

        /**
         * Creates a ModelParams message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.ModelParams
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.ModelParams} ModelParams
         */
        ModelParams.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.ModelParams)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.ModelParams: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.ModelParams();
            if (object.offlatticeDla2d != null) {
                if (!$util.isObject(object.offlatticeDla2d))
                    throw $TypeError(".tendril.ModelParams.offlatticeDla2d: object expected");
                message.offlatticeDla2d = $root.tendril.OffLatticeDla2dParams.fromObject(object.offlatticeDla2d, _depth + 1);
            }
            if (object.kind != null)
                if (typeof object.kind !== "string" || object.kind.length)
                    message.kind = $String(object.kind);
            if (object.params) {
                if (!$util.isObject(object.params))
                    throw $TypeError(".tendril.ModelParams.params: object expected");
                message.params = {};
                for (let keys = $Object.keys(object.params), i = 0; i < keys.length; ++i) {
                    if (keys[i] === "__proto__")
                        $util.makeProp(message.params, keys[i]);
                    message.params[keys[i]] = $Number(object.params[keys[i]]);
                }
            }
            return message;
        };

        /**
         * Creates a plain object from a ModelParams message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.ModelParams
         * @static
         * @param {tendril.ModelParams} message ModelParams
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        ModelParams.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.objects || options.defaults)
                object.params = {};
            if (options.defaults)
                object.kind = "";
            if (message.offlatticeDla2d != null && $Object.hasOwnProperty.call(message, "offlatticeDla2d")) {
                object.offlatticeDla2d = $root.tendril.OffLatticeDla2dParams.toObject(message.offlatticeDla2d, options, _depth + 1);
                if (options.oneofs)
                    object.legacy = "offlatticeDla2d";
            }
            if (message.kind != null && $Object.hasOwnProperty.call(message, "kind"))
                object.kind = message.kind;
            let keys2;
            if (message.params && (keys2 = $Object.keys(message.params)).length) {
                object.params = {};
                for (let j = 0; j < keys2.length; ++j) {
                    if (keys2[j] === "__proto__")
                        $util.makeProp(object.params, keys2[j]);
                    object.params[keys2[j]] = options.json && !$isFinite(message.params[keys2[j]]) ? $String(message.params[keys2[j]]) : message.params[keys2[j]];
                }
            }
            return object;
        };

        /**
         * Converts this ModelParams to JSON.
         * @function toJSON
         * @memberof tendril.ModelParams
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        ModelParams.prototype.toJSON = function() {
            return ModelParams.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for ModelParams
         * @function getTypeUrl
         * @memberof tendril.ModelParams
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        ModelParams.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.ModelParams";
        };

        return ModelParams;
    })();

    tendril.RunTask = (function() {

        /**
         * Properties of a RunTask.
         * @typedef {Object} tendril.RunTask.$Properties
         * @property {number|null} [contractVersion] RunTask contractVersion
         * @property {string|null} [ensembleId] RunTask ensembleId
         * @property {number|null} [runIndex] RunTask runIndex
         * @property {string|null} [ensembleSeed] RunTask ensembleSeed
         * @property {tendril.ModelParams.$Properties|null} [model] RunTask model
         * @property {number|null} [particles] RunTask particles
         * @property {number|null} [recordsPerDecade] RunTask recordsPerDecade
         * @property {number|null} [checkpointIntervalSeconds] RunTask checkpointIntervalSeconds
         * @property {number|null} [checkpointEveryParticles] RunTask checkpointEveryParticles
         * @property {string|null} [engineVersion] RunTask engineVersion
         * @property {boolean|null} [keepPositions] RunTask keepPositions
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a RunTask.
         * @memberof tendril
         * @interface IRunTask
         * @augments tendril.RunTask.$Properties
         * @deprecated Use tendril.RunTask.$Properties instead.
         */

        /**
         * Shape of a RunTask.
         * @typedef {{
         *   contractVersion?: number|null;
         *   ensembleId?: string|null;
         *   runIndex?: number|null;
         *   ensembleSeed?: string|null;
         *   model?: tendril.ModelParams.$Shape|null;
         *   particles?: number|null;
         *   recordsPerDecade?: number|null;
         *   checkpointIntervalSeconds?: number|null;
         *   checkpointEveryParticles?: number|null;
         *   engineVersion?: string|null;
         *   keepPositions?: boolean|null;
         *   $unknowns?: Array.<Uint8Array>;
         * }} tendril.RunTask.$Shape
         */

        /**
         * Constructs a new RunTask.
         * @memberof tendril
         * @classdesc Represents a RunTask.
         * @constructor
         * @param {tendril.RunTask.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const RunTask = function (properties) {
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * RunTask contractVersion.
         * @member {number} contractVersion
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.contractVersion = 0;

        /**
         * RunTask ensembleId.
         * @member {string} ensembleId
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.ensembleId = "";

        /**
         * RunTask runIndex.
         * @member {number} runIndex
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.runIndex = 0;

        /**
         * RunTask ensembleSeed.
         * @member {string} ensembleSeed
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.ensembleSeed = "";

        /**
         * RunTask model.
         * @member {tendril.ModelParams.$Properties|null|undefined} model
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.model = null;

        /**
         * RunTask particles.
         * @member {number} particles
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.particles = 0;

        /**
         * RunTask recordsPerDecade.
         * @member {number} recordsPerDecade
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.recordsPerDecade = 0;

        /**
         * RunTask checkpointIntervalSeconds.
         * @member {number} checkpointIntervalSeconds
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.checkpointIntervalSeconds = 0;

        /**
         * RunTask checkpointEveryParticles.
         * @member {number} checkpointEveryParticles
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.checkpointEveryParticles = 0;

        /**
         * RunTask engineVersion.
         * @member {string} engineVersion
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.engineVersion = "";

        /**
         * RunTask keepPositions.
         * @member {boolean} keepPositions
         * @memberof tendril.RunTask
         * @instance
         */
        RunTask.prototype.keepPositions = false;

        /**
         * Creates a new RunTask instance using the specified properties.
         * @function create
         * @memberof tendril.RunTask
         * @static
         * @param {tendril.RunTask.$Properties=} [properties] Properties to set
         * @returns {tendril.RunTask} RunTask instance
         * @type {{
         *   (properties: tendril.RunTask.$Shape): tendril.RunTask & tendril.RunTask.$Shape;
         *   (properties?: tendril.RunTask.$Properties): tendril.RunTask;
         * }}
         */
        RunTask.create = function(properties) {
            return new RunTask(properties);
        };

        /**
         * Encodes the specified RunTask message. Does not implicitly {@link tendril.RunTask.verify|verify} messages.
         * @function encode
         * @memberof tendril.RunTask
         * @static
         * @param {tendril.RunTask.$Properties} message RunTask message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        RunTask.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion") && message.contractVersion !== 0)
                writer.uint32(/* id 1, wireType 0 =*/8).uint32(message.contractVersion);
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId") && message.ensembleId !== "")
                writer.uint32(/* id 2, wireType 2 =*/18).string(message.ensembleId);
            if (message.runIndex != null && $Object.hasOwnProperty.call(message, "runIndex") && message.runIndex !== 0)
                writer.uint32(/* id 3, wireType 0 =*/24).uint32(message.runIndex);
            if (message.ensembleSeed != null && $Object.hasOwnProperty.call(message, "ensembleSeed") && message.ensembleSeed !== "")
                writer.uint32(/* id 4, wireType 2 =*/34).string(message.ensembleSeed);
            if (message.model != null && $Object.hasOwnProperty.call(message, "model"))
                $root.tendril.ModelParams.encode(message.model, writer.uint32(/* id 5, wireType 2 =*/42).fork(), _depth + 1).ldelim();
            if (message.particles != null && $Object.hasOwnProperty.call(message, "particles") && message.particles !== 0)
                writer.uint32(/* id 6, wireType 0 =*/48).uint32(message.particles);
            if (message.recordsPerDecade != null && $Object.hasOwnProperty.call(message, "recordsPerDecade") && message.recordsPerDecade !== 0)
                writer.uint32(/* id 7, wireType 0 =*/56).uint32(message.recordsPerDecade);
            if (message.checkpointIntervalSeconds != null && $Object.hasOwnProperty.call(message, "checkpointIntervalSeconds") && !$Object.is(message.checkpointIntervalSeconds, 0))
                writer.uint32(/* id 8, wireType 1 =*/65).double(message.checkpointIntervalSeconds);
            if (message.checkpointEveryParticles != null && $Object.hasOwnProperty.call(message, "checkpointEveryParticles") && message.checkpointEveryParticles !== 0)
                writer.uint32(/* id 9, wireType 0 =*/72).uint32(message.checkpointEveryParticles);
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion") && message.engineVersion !== "")
                writer.uint32(/* id 10, wireType 2 =*/82).string(message.engineVersion);
            if (message.keepPositions != null && $Object.hasOwnProperty.call(message, "keepPositions") && message.keepPositions !== false)
                writer.uint32(/* id 11, wireType 0 =*/88).bool(message.keepPositions);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified RunTask message, length delimited. Does not implicitly {@link tendril.RunTask.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.RunTask
         * @static
         * @param {tendril.RunTask.$Properties} message RunTask message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        RunTask.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a RunTask message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.RunTask
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.RunTask & tendril.RunTask.$Shape} RunTask
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        RunTask.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.RunTask();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.contractVersion = value;
                        else
                            delete message.contractVersion;
                        continue;
                    }
                case 2: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.ensembleId = value;
                        else
                            delete message.ensembleId;
                        continue;
                    }
                case 3: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.runIndex = value;
                        else
                            delete message.runIndex;
                        continue;
                    }
                case 4: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.ensembleSeed = value;
                        else
                            delete message.ensembleSeed;
                        continue;
                    }
                case 5: {
                        if (wireType !== 2)
                            break;
                        message.model = $root.tendril.ModelParams.decode(reader, reader.size(), $undefined, _depth + 1, message.model);
                        continue;
                    }
                case 6: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.particles = value;
                        else
                            delete message.particles;
                        continue;
                    }
                case 7: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.recordsPerDecade = value;
                        else
                            delete message.recordsPerDecade;
                        continue;
                    }
                case 8: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.checkpointIntervalSeconds = value;
                        else
                            delete message.checkpointIntervalSeconds;
                        continue;
                    }
                case 9: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.checkpointEveryParticles = value;
                        else
                            delete message.checkpointEveryParticles;
                        continue;
                    }
                case 10: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.engineVersion = value;
                        else
                            delete message.engineVersion;
                        continue;
                    }
                case 11: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.bool())
                            message.keepPositions = value;
                        else
                            delete message.keepPositions;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a RunTask message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.RunTask
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.RunTask & tendril.RunTask.$Shape} RunTask
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        RunTask.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a RunTask message.
         * @function verify
         * @memberof tendril.RunTask
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        RunTask.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion"))
                if (!$util.isInteger(message.contractVersion))
                    return "contractVersion: integer expected";
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId"))
                if (!$util.isString(message.ensembleId))
                    return "ensembleId: string expected";
            if (message.runIndex != null && $Object.hasOwnProperty.call(message, "runIndex"))
                if (!$util.isInteger(message.runIndex))
                    return "runIndex: integer expected";
            if (message.ensembleSeed != null && $Object.hasOwnProperty.call(message, "ensembleSeed"))
                if (!$util.isString(message.ensembleSeed))
                    return "ensembleSeed: string expected";
            if (message.model != null && $Object.hasOwnProperty.call(message, "model")) {
                let error = $root.tendril.ModelParams.verify(message.model, _depth + 1);
                if (error)
                    return "model." + error;
            }
            if (message.particles != null && $Object.hasOwnProperty.call(message, "particles"))
                if (!$util.isInteger(message.particles))
                    return "particles: integer expected";
            if (message.recordsPerDecade != null && $Object.hasOwnProperty.call(message, "recordsPerDecade"))
                if (!$util.isInteger(message.recordsPerDecade))
                    return "recordsPerDecade: integer expected";
            if (message.checkpointIntervalSeconds != null && $Object.hasOwnProperty.call(message, "checkpointIntervalSeconds"))
                if (typeof message.checkpointIntervalSeconds !== "number")
                    return "checkpointIntervalSeconds: number expected";
            if (message.checkpointEveryParticles != null && $Object.hasOwnProperty.call(message, "checkpointEveryParticles"))
                if (!$util.isInteger(message.checkpointEveryParticles))
                    return "checkpointEveryParticles: integer expected";
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion"))
                if (!$util.isString(message.engineVersion))
                    return "engineVersion: string expected";
            if (message.keepPositions != null && $Object.hasOwnProperty.call(message, "keepPositions"))
                if (typeof message.keepPositions !== "boolean")
                    return "keepPositions: boolean expected";
            return null;
        };

        /**
         * Creates a RunTask message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.RunTask
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.RunTask} RunTask
         */
        RunTask.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.RunTask)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.RunTask: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.RunTask();
            if (object.contractVersion != null)
                if ($Number(object.contractVersion) !== 0)
                    message.contractVersion = object.contractVersion >>> 0;
            if (object.ensembleId != null)
                if (typeof object.ensembleId !== "string" || object.ensembleId.length)
                    message.ensembleId = $String(object.ensembleId);
            if (object.runIndex != null)
                if ($Number(object.runIndex) !== 0)
                    message.runIndex = object.runIndex >>> 0;
            if (object.ensembleSeed != null)
                if (typeof object.ensembleSeed !== "string" || object.ensembleSeed.length)
                    message.ensembleSeed = $String(object.ensembleSeed);
            if (object.model != null) {
                if (!$util.isObject(object.model))
                    throw $TypeError(".tendril.RunTask.model: object expected");
                message.model = $root.tendril.ModelParams.fromObject(object.model, _depth + 1);
            }
            if (object.particles != null)
                if ($Number(object.particles) !== 0)
                    message.particles = object.particles >>> 0;
            if (object.recordsPerDecade != null)
                if ($Number(object.recordsPerDecade) !== 0)
                    message.recordsPerDecade = object.recordsPerDecade >>> 0;
            if (object.checkpointIntervalSeconds != null)
                if (!$Object.is($Number(object.checkpointIntervalSeconds), 0))
                    message.checkpointIntervalSeconds = $Number(object.checkpointIntervalSeconds);
            if (object.checkpointEveryParticles != null)
                if ($Number(object.checkpointEveryParticles) !== 0)
                    message.checkpointEveryParticles = object.checkpointEveryParticles >>> 0;
            if (object.engineVersion != null)
                if (typeof object.engineVersion !== "string" || object.engineVersion.length)
                    message.engineVersion = $String(object.engineVersion);
            if (object.keepPositions != null)
                if (object.keepPositions)
                    message.keepPositions = $Boolean(object.keepPositions);
            return message;
        };

        /**
         * Creates a plain object from a RunTask message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.RunTask
         * @static
         * @param {tendril.RunTask} message RunTask
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        RunTask.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.defaults) {
                object.contractVersion = 0;
                object.ensembleId = "";
                object.runIndex = 0;
                object.ensembleSeed = "";
                object.model = null;
                object.particles = 0;
                object.recordsPerDecade = 0;
                object.checkpointIntervalSeconds = 0;
                object.checkpointEveryParticles = 0;
                object.engineVersion = "";
                object.keepPositions = false;
            }
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion"))
                object.contractVersion = message.contractVersion;
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId"))
                object.ensembleId = message.ensembleId;
            if (message.runIndex != null && $Object.hasOwnProperty.call(message, "runIndex"))
                object.runIndex = message.runIndex;
            if (message.ensembleSeed != null && $Object.hasOwnProperty.call(message, "ensembleSeed"))
                object.ensembleSeed = message.ensembleSeed;
            if (message.model != null && $Object.hasOwnProperty.call(message, "model"))
                object.model = $root.tendril.ModelParams.toObject(message.model, options, _depth + 1);
            if (message.particles != null && $Object.hasOwnProperty.call(message, "particles"))
                object.particles = message.particles;
            if (message.recordsPerDecade != null && $Object.hasOwnProperty.call(message, "recordsPerDecade"))
                object.recordsPerDecade = message.recordsPerDecade;
            if (message.checkpointIntervalSeconds != null && $Object.hasOwnProperty.call(message, "checkpointIntervalSeconds"))
                object.checkpointIntervalSeconds = options.json && !$isFinite(message.checkpointIntervalSeconds) ? $String(message.checkpointIntervalSeconds) : message.checkpointIntervalSeconds;
            if (message.checkpointEveryParticles != null && $Object.hasOwnProperty.call(message, "checkpointEveryParticles"))
                object.checkpointEveryParticles = message.checkpointEveryParticles;
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion"))
                object.engineVersion = message.engineVersion;
            if (message.keepPositions != null && $Object.hasOwnProperty.call(message, "keepPositions"))
                object.keepPositions = message.keepPositions;
            return object;
        };

        /**
         * Converts this RunTask to JSON.
         * @function toJSON
         * @memberof tendril.RunTask
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        RunTask.prototype.toJSON = function() {
            return RunTask.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for RunTask
         * @function getTypeUrl
         * @memberof tendril.RunTask
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        RunTask.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.RunTask";
        };

        return RunTask;
    })();

    tendril.DoubleList = (function() {

        /**
         * Properties of a DoubleList.
         * @typedef {Object} tendril.DoubleList.$Properties
         * @property {Array.<number>|null} [values] DoubleList values
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a DoubleList.
         * @memberof tendril
         * @interface IDoubleList
         * @augments tendril.DoubleList.$Properties
         * @deprecated Use tendril.DoubleList.$Properties instead.
         */

        /**
         * Shape of a DoubleList.
         * @typedef {tendril.DoubleList.$Properties} tendril.DoubleList.$Shape
         */

        /**
         * Constructs a new DoubleList.
         * @memberof tendril
         * @classdesc Represents a DoubleList.
         * @constructor
         * @param {tendril.DoubleList.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const DoubleList = function (properties) {
            this.values = [];
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * DoubleList values.
         * @member {Array.<number>} values
         * @memberof tendril.DoubleList
         * @instance
         */
        DoubleList.prototype.values = $util.emptyArray;

        /**
         * Creates a new DoubleList instance using the specified properties.
         * @function create
         * @memberof tendril.DoubleList
         * @static
         * @param {tendril.DoubleList.$Properties=} [properties] Properties to set
         * @returns {tendril.DoubleList} DoubleList instance
         * @type {{
         *   (properties: tendril.DoubleList.$Shape): tendril.DoubleList & tendril.DoubleList.$Shape;
         *   (properties?: tendril.DoubleList.$Properties): tendril.DoubleList;
         * }}
         */
        DoubleList.create = function(properties) {
            return new DoubleList(properties);
        };

        /**
         * Encodes the specified DoubleList message. Does not implicitly {@link tendril.DoubleList.verify|verify} messages.
         * @function encode
         * @memberof tendril.DoubleList
         * @static
         * @param {tendril.DoubleList.$Properties} message DoubleList message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        DoubleList.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.values != null && message.values.length)
                writer.uint32(/* id 1, wireType 2 =*/10).doubles(message.values);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified DoubleList message, length delimited. Does not implicitly {@link tendril.DoubleList.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.DoubleList
         * @static
         * @param {tendril.DoubleList.$Properties} message DoubleList message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        DoubleList.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a DoubleList message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.DoubleList
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.DoubleList & tendril.DoubleList.$Shape} DoubleList
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        DoubleList.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.DoubleList();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType === 2) {
                            if (!(message.values && message.values.length))
                                message.values = [];
                            reader.doubles(message.values);
                            continue;
                        }
                        if (wireType !== 1)
                            break;
                        if (!(message.values && message.values.length))
                            message.values = [];
                        message.values.push(reader.double());
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a DoubleList message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.DoubleList
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.DoubleList & tendril.DoubleList.$Shape} DoubleList
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        DoubleList.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a DoubleList message.
         * @function verify
         * @memberof tendril.DoubleList
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        DoubleList.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.values != null && $Object.hasOwnProperty.call(message, "values")) {
                if (!$Array.isArray(message.values))
                    return "values: array expected";
                for (let i = 0; i < message.values.length; ++i)
                    if (typeof message.values[i] !== "number")
                        return "values: number[] expected";
            }
            return null;
        };

        /**
         * Creates a DoubleList message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.DoubleList
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.DoubleList} DoubleList
         */
        DoubleList.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.DoubleList)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.DoubleList: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.DoubleList();
            if (object.values) {
                if (!$Array.isArray(object.values))
                    throw $TypeError(".tendril.DoubleList.values: array expected");
                message.values = $Array(object.values.length);
                for (let i = 0; i < object.values.length; ++i)
                    message.values[i] = $Number(object.values[i]);
            }
            return message;
        };

        /**
         * Creates a plain object from a DoubleList message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.DoubleList
         * @static
         * @param {tendril.DoubleList} message DoubleList
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        DoubleList.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.arrays || options.defaults)
                object.values = [];
            if (message.values && message.values.length) {
                object.values = $Array(message.values.length);
                for (let j = 0; j < message.values.length; ++j)
                    object.values[j] = options.json && !$isFinite(message.values[j]) ? $String(message.values[j]) : message.values[j];
            }
            return object;
        };

        /**
         * Converts this DoubleList to JSON.
         * @function toJSON
         * @memberof tendril.DoubleList
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        DoubleList.prototype.toJSON = function() {
            return DoubleList.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for DoubleList
         * @function getTypeUrl
         * @memberof tendril.DoubleList
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        DoubleList.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.DoubleList";
        };

        return DoubleList;
    })();

    tendril.GrowthSeries = (function() {

        /**
         * Properties of a GrowthSeries.
         * @typedef {Object} tendril.GrowthSeries.$Properties
         * @property {Array.<number>|null} [sizes] GrowthSeries sizes
         * @property {Array.<number>|null} [radiusOfGyration] GrowthSeries radiusOfGyration
         * @property {Array.<number>|null} [maxRadius] GrowthSeries maxRadius
         * @property {Array.<number>|null} [centerOffset] GrowthSeries centerOffset
         * @property {Object.<string,tendril.DoubleList.$Properties>|null} [extra] GrowthSeries extra
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a GrowthSeries.
         * @memberof tendril
         * @interface IGrowthSeries
         * @augments tendril.GrowthSeries.$Properties
         * @deprecated Use tendril.GrowthSeries.$Properties instead.
         */

        /**
         * Shape of a GrowthSeries.
         * @typedef {tendril.GrowthSeries.$Properties} tendril.GrowthSeries.$Shape
         */

        /**
         * Constructs a new GrowthSeries.
         * @memberof tendril
         * @classdesc Represents a GrowthSeries.
         * @constructor
         * @param {tendril.GrowthSeries.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const GrowthSeries = function (properties) {
            this.sizes = [];
            this.radiusOfGyration = [];
            this.maxRadius = [];
            this.centerOffset = [];
            this.extra = {};
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * GrowthSeries sizes.
         * @member {Array.<number>} sizes
         * @memberof tendril.GrowthSeries
         * @instance
         */
        GrowthSeries.prototype.sizes = $util.emptyArray;

        /**
         * GrowthSeries radiusOfGyration.
         * @member {Array.<number>} radiusOfGyration
         * @memberof tendril.GrowthSeries
         * @instance
         */
        GrowthSeries.prototype.radiusOfGyration = $util.emptyArray;

        /**
         * GrowthSeries maxRadius.
         * @member {Array.<number>} maxRadius
         * @memberof tendril.GrowthSeries
         * @instance
         */
        GrowthSeries.prototype.maxRadius = $util.emptyArray;

        /**
         * GrowthSeries centerOffset.
         * @member {Array.<number>} centerOffset
         * @memberof tendril.GrowthSeries
         * @instance
         */
        GrowthSeries.prototype.centerOffset = $util.emptyArray;

        /**
         * GrowthSeries extra.
         * @member {Object.<string,tendril.DoubleList.$Properties>} extra
         * @memberof tendril.GrowthSeries
         * @instance
         */
        GrowthSeries.prototype.extra = $util.emptyObject;

        /**
         * Creates a new GrowthSeries instance using the specified properties.
         * @function create
         * @memberof tendril.GrowthSeries
         * @static
         * @param {tendril.GrowthSeries.$Properties=} [properties] Properties to set
         * @returns {tendril.GrowthSeries} GrowthSeries instance
         * @type {{
         *   (properties: tendril.GrowthSeries.$Shape): tendril.GrowthSeries & tendril.GrowthSeries.$Shape;
         *   (properties?: tendril.GrowthSeries.$Properties): tendril.GrowthSeries;
         * }}
         */
        GrowthSeries.create = function(properties) {
            return new GrowthSeries(properties);
        };

        /**
         * Encodes the specified GrowthSeries message. Does not implicitly {@link tendril.GrowthSeries.verify|verify} messages.
         * @function encode
         * @memberof tendril.GrowthSeries
         * @static
         * @param {tendril.GrowthSeries.$Properties} message GrowthSeries message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        GrowthSeries.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.sizes != null && message.sizes.length)
                writer.uint32(/* id 1, wireType 2 =*/10).uint32s(message.sizes);
            if (message.radiusOfGyration != null && message.radiusOfGyration.length)
                writer.uint32(/* id 2, wireType 2 =*/18).doubles(message.radiusOfGyration);
            if (message.maxRadius != null && message.maxRadius.length)
                writer.uint32(/* id 3, wireType 2 =*/26).doubles(message.maxRadius);
            if (message.centerOffset != null && message.centerOffset.length)
                writer.uint32(/* id 4, wireType 2 =*/34).doubles(message.centerOffset);
            if (message.extra != null && $Object.hasOwnProperty.call(message, "extra"))
                for (let keys = $Object.keys(message.extra), i = 0; i < keys.length; ++i) {
                    writer.uint32(/* id 5, wireType 2 =*/42).fork().uint32(/* id 1, wireType 2 =*/10).string(keys[i]);
                    $root.tendril.DoubleList.encode(message.extra[keys[i]], writer.uint32(/* id 2, wireType 2 =*/18).fork(), _depth + 1).ldelim().ldelim();
                }
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified GrowthSeries message, length delimited. Does not implicitly {@link tendril.GrowthSeries.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.GrowthSeries
         * @static
         * @param {tendril.GrowthSeries.$Properties} message GrowthSeries message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        GrowthSeries.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a GrowthSeries message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.GrowthSeries
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.GrowthSeries & tendril.GrowthSeries.$Shape} GrowthSeries
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        GrowthSeries.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, key, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.GrowthSeries();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType === 2) {
                            if (!(message.sizes && message.sizes.length))
                                message.sizes = [];
                            reader.uint32s(message.sizes);
                            continue;
                        }
                        if (wireType !== 0)
                            break;
                        if (!(message.sizes && message.sizes.length))
                            message.sizes = [];
                        message.sizes.push(reader.uint32());
                        continue;
                    }
                case 2: {
                        if (wireType === 2) {
                            if (!(message.radiusOfGyration && message.radiusOfGyration.length))
                                message.radiusOfGyration = [];
                            reader.doubles(message.radiusOfGyration);
                            continue;
                        }
                        if (wireType !== 1)
                            break;
                        if (!(message.radiusOfGyration && message.radiusOfGyration.length))
                            message.radiusOfGyration = [];
                        message.radiusOfGyration.push(reader.double());
                        continue;
                    }
                case 3: {
                        if (wireType === 2) {
                            if (!(message.maxRadius && message.maxRadius.length))
                                message.maxRadius = [];
                            reader.doubles(message.maxRadius);
                            continue;
                        }
                        if (wireType !== 1)
                            break;
                        if (!(message.maxRadius && message.maxRadius.length))
                            message.maxRadius = [];
                        message.maxRadius.push(reader.double());
                        continue;
                    }
                case 4: {
                        if (wireType === 2) {
                            if (!(message.centerOffset && message.centerOffset.length))
                                message.centerOffset = [];
                            reader.doubles(message.centerOffset);
                            continue;
                        }
                        if (wireType !== 1)
                            break;
                        if (!(message.centerOffset && message.centerOffset.length))
                            message.centerOffset = [];
                        message.centerOffset.push(reader.double());
                        continue;
                    }
                case 5: {
                        if (wireType !== 2)
                            break;
                        if (message.extra === $util.emptyObject)
                            message.extra = {};
                        let end2 = reader.size() + reader.pos;
                        if (end2 > reader.len)
                            throw $RangeError("index out of range");
                        reader.len = end2;
                        key = "";
                        value = null;
                        while (reader.pos < end2) {
                            let tag2 = reader.tag();
                            wireType = tag2 & 7;
                            switch (tag2 >>>= 3) {
                            case 1:
                                if (wireType !== 2)
                                    break;
                                key = reader.stringVerify();
                                continue;
                            case 2:
                                if (wireType !== 2)
                                    break;
                                value = $root.tendril.DoubleList.decode(reader, reader.size(), $undefined, _depth + 1, value);
                                continue;
                            }
                            reader.skipType(wireType, _depth, tag2);
                        }
                        if (reader.pos !== end2)
                            throw $RangeError("index out of range");
                        reader.len = end;
                        if (key === "__proto__")
                            $util.makeProp(message.extra, key);
                        message.extra[key] = value || new $root.tendril.DoubleList();
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a GrowthSeries message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.GrowthSeries
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.GrowthSeries & tendril.GrowthSeries.$Shape} GrowthSeries
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        GrowthSeries.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a GrowthSeries message.
         * @function verify
         * @memberof tendril.GrowthSeries
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        GrowthSeries.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.sizes != null && $Object.hasOwnProperty.call(message, "sizes")) {
                if (!$Array.isArray(message.sizes))
                    return "sizes: array expected";
                for (let i = 0; i < message.sizes.length; ++i)
                    if (!$util.isInteger(message.sizes[i]))
                        return "sizes: integer[] expected";
            }
            if (message.radiusOfGyration != null && $Object.hasOwnProperty.call(message, "radiusOfGyration")) {
                if (!$Array.isArray(message.radiusOfGyration))
                    return "radiusOfGyration: array expected";
                for (let i = 0; i < message.radiusOfGyration.length; ++i)
                    if (typeof message.radiusOfGyration[i] !== "number")
                        return "radiusOfGyration: number[] expected";
            }
            if (message.maxRadius != null && $Object.hasOwnProperty.call(message, "maxRadius")) {
                if (!$Array.isArray(message.maxRadius))
                    return "maxRadius: array expected";
                for (let i = 0; i < message.maxRadius.length; ++i)
                    if (typeof message.maxRadius[i] !== "number")
                        return "maxRadius: number[] expected";
            }
            if (message.centerOffset != null && $Object.hasOwnProperty.call(message, "centerOffset")) {
                if (!$Array.isArray(message.centerOffset))
                    return "centerOffset: array expected";
                for (let i = 0; i < message.centerOffset.length; ++i)
                    if (typeof message.centerOffset[i] !== "number")
                        return "centerOffset: number[] expected";
            }
            if (message.extra != null && $Object.hasOwnProperty.call(message, "extra")) {
                if (!$util.isObject(message.extra))
                    return "extra: object expected";
                let key = $Object.keys(message.extra);
                for (let i = 0; i < key.length; ++i) {
                    let error = $root.tendril.DoubleList.verify(message.extra[key[i]], _depth + 1);
                    if (error)
                        return "extra." + error;
                }
            }
            return null;
        };

        /**
         * Creates a GrowthSeries message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.GrowthSeries
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.GrowthSeries} GrowthSeries
         */
        GrowthSeries.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.GrowthSeries)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.GrowthSeries: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.GrowthSeries();
            if (object.sizes) {
                if (!$Array.isArray(object.sizes))
                    throw $TypeError(".tendril.GrowthSeries.sizes: array expected");
                message.sizes = $Array(object.sizes.length);
                for (let i = 0; i < object.sizes.length; ++i)
                    message.sizes[i] = object.sizes[i] >>> 0;
            }
            if (object.radiusOfGyration) {
                if (!$Array.isArray(object.radiusOfGyration))
                    throw $TypeError(".tendril.GrowthSeries.radiusOfGyration: array expected");
                message.radiusOfGyration = $Array(object.radiusOfGyration.length);
                for (let i = 0; i < object.radiusOfGyration.length; ++i)
                    message.radiusOfGyration[i] = $Number(object.radiusOfGyration[i]);
            }
            if (object.maxRadius) {
                if (!$Array.isArray(object.maxRadius))
                    throw $TypeError(".tendril.GrowthSeries.maxRadius: array expected");
                message.maxRadius = $Array(object.maxRadius.length);
                for (let i = 0; i < object.maxRadius.length; ++i)
                    message.maxRadius[i] = $Number(object.maxRadius[i]);
            }
            if (object.centerOffset) {
                if (!$Array.isArray(object.centerOffset))
                    throw $TypeError(".tendril.GrowthSeries.centerOffset: array expected");
                message.centerOffset = $Array(object.centerOffset.length);
                for (let i = 0; i < object.centerOffset.length; ++i)
                    message.centerOffset[i] = $Number(object.centerOffset[i]);
            }
            if (object.extra) {
                if (!$util.isObject(object.extra))
                    throw $TypeError(".tendril.GrowthSeries.extra: object expected");
                message.extra = {};
                for (let keys = $Object.keys(object.extra), i = 0; i < keys.length; ++i) {
                    if (keys[i] === "__proto__")
                        $util.makeProp(message.extra, keys[i]);
                    if (!$util.isObject(object.extra[keys[i]]))
                        throw $TypeError(".tendril.GrowthSeries.extra: object expected");
                    message.extra[keys[i]] = $root.tendril.DoubleList.fromObject(object.extra[keys[i]], _depth + 1);
                }
            }
            return message;
        };

        /**
         * Creates a plain object from a GrowthSeries message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.GrowthSeries
         * @static
         * @param {tendril.GrowthSeries} message GrowthSeries
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        GrowthSeries.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.arrays || options.defaults) {
                object.sizes = [];
                object.radiusOfGyration = [];
                object.maxRadius = [];
                object.centerOffset = [];
            }
            if (options.objects || options.defaults)
                object.extra = {};
            if (message.sizes && message.sizes.length) {
                object.sizes = $Array(message.sizes.length);
                for (let j = 0; j < message.sizes.length; ++j)
                    object.sizes[j] = message.sizes[j];
            }
            if (message.radiusOfGyration && message.radiusOfGyration.length) {
                object.radiusOfGyration = $Array(message.radiusOfGyration.length);
                for (let j = 0; j < message.radiusOfGyration.length; ++j)
                    object.radiusOfGyration[j] = options.json && !$isFinite(message.radiusOfGyration[j]) ? $String(message.radiusOfGyration[j]) : message.radiusOfGyration[j];
            }
            if (message.maxRadius && message.maxRadius.length) {
                object.maxRadius = $Array(message.maxRadius.length);
                for (let j = 0; j < message.maxRadius.length; ++j)
                    object.maxRadius[j] = options.json && !$isFinite(message.maxRadius[j]) ? $String(message.maxRadius[j]) : message.maxRadius[j];
            }
            if (message.centerOffset && message.centerOffset.length) {
                object.centerOffset = $Array(message.centerOffset.length);
                for (let j = 0; j < message.centerOffset.length; ++j)
                    object.centerOffset[j] = options.json && !$isFinite(message.centerOffset[j]) ? $String(message.centerOffset[j]) : message.centerOffset[j];
            }
            let keys2;
            if (message.extra && (keys2 = $Object.keys(message.extra)).length) {
                object.extra = {};
                for (let j = 0; j < keys2.length; ++j) {
                    if (keys2[j] === "__proto__")
                        $util.makeProp(object.extra, keys2[j]);
                    object.extra[keys2[j]] = $root.tendril.DoubleList.toObject(message.extra[keys2[j]], options, _depth + 1);
                }
            }
            return object;
        };

        /**
         * Converts this GrowthSeries to JSON.
         * @function toJSON
         * @memberof tendril.GrowthSeries
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        GrowthSeries.prototype.toJSON = function() {
            return GrowthSeries.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for GrowthSeries
         * @function getTypeUrl
         * @memberof tendril.GrowthSeries
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        GrowthSeries.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.GrowthSeries";
        };

        return GrowthSeries;
    })();

    tendril.MassRadius = (function() {

        /**
         * Properties of a MassRadius.
         * @typedef {Object} tendril.MassRadius.$Properties
         * @property {Array.<number>|null} [radii] MassRadius radii
         * @property {Array.<number>|null} [counts] MassRadius counts
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a MassRadius.
         * @memberof tendril
         * @interface IMassRadius
         * @augments tendril.MassRadius.$Properties
         * @deprecated Use tendril.MassRadius.$Properties instead.
         */

        /**
         * Shape of a MassRadius.
         * @typedef {tendril.MassRadius.$Properties} tendril.MassRadius.$Shape
         */

        /**
         * Constructs a new MassRadius.
         * @memberof tendril
         * @classdesc Represents a MassRadius.
         * @constructor
         * @param {tendril.MassRadius.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const MassRadius = function (properties) {
            this.radii = [];
            this.counts = [];
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * MassRadius radii.
         * @member {Array.<number>} radii
         * @memberof tendril.MassRadius
         * @instance
         */
        MassRadius.prototype.radii = $util.emptyArray;

        /**
         * MassRadius counts.
         * @member {Array.<number>} counts
         * @memberof tendril.MassRadius
         * @instance
         */
        MassRadius.prototype.counts = $util.emptyArray;

        /**
         * Creates a new MassRadius instance using the specified properties.
         * @function create
         * @memberof tendril.MassRadius
         * @static
         * @param {tendril.MassRadius.$Properties=} [properties] Properties to set
         * @returns {tendril.MassRadius} MassRadius instance
         * @type {{
         *   (properties: tendril.MassRadius.$Shape): tendril.MassRadius & tendril.MassRadius.$Shape;
         *   (properties?: tendril.MassRadius.$Properties): tendril.MassRadius;
         * }}
         */
        MassRadius.create = function(properties) {
            return new MassRadius(properties);
        };

        /**
         * Encodes the specified MassRadius message. Does not implicitly {@link tendril.MassRadius.verify|verify} messages.
         * @function encode
         * @memberof tendril.MassRadius
         * @static
         * @param {tendril.MassRadius.$Properties} message MassRadius message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        MassRadius.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.radii != null && message.radii.length)
                writer.uint32(/* id 1, wireType 2 =*/10).doubles(message.radii);
            if (message.counts != null && message.counts.length)
                writer.uint32(/* id 2, wireType 2 =*/18).doubles(message.counts);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified MassRadius message, length delimited. Does not implicitly {@link tendril.MassRadius.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.MassRadius
         * @static
         * @param {tendril.MassRadius.$Properties} message MassRadius message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        MassRadius.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a MassRadius message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.MassRadius
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.MassRadius & tendril.MassRadius.$Shape} MassRadius
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        MassRadius.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.MassRadius();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType === 2) {
                            if (!(message.radii && message.radii.length))
                                message.radii = [];
                            reader.doubles(message.radii);
                            continue;
                        }
                        if (wireType !== 1)
                            break;
                        if (!(message.radii && message.radii.length))
                            message.radii = [];
                        message.radii.push(reader.double());
                        continue;
                    }
                case 2: {
                        if (wireType === 2) {
                            if (!(message.counts && message.counts.length))
                                message.counts = [];
                            reader.doubles(message.counts);
                            continue;
                        }
                        if (wireType !== 1)
                            break;
                        if (!(message.counts && message.counts.length))
                            message.counts = [];
                        message.counts.push(reader.double());
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a MassRadius message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.MassRadius
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.MassRadius & tendril.MassRadius.$Shape} MassRadius
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        MassRadius.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a MassRadius message.
         * @function verify
         * @memberof tendril.MassRadius
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        MassRadius.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.radii != null && $Object.hasOwnProperty.call(message, "radii")) {
                if (!$Array.isArray(message.radii))
                    return "radii: array expected";
                for (let i = 0; i < message.radii.length; ++i)
                    if (typeof message.radii[i] !== "number")
                        return "radii: number[] expected";
            }
            if (message.counts != null && $Object.hasOwnProperty.call(message, "counts")) {
                if (!$Array.isArray(message.counts))
                    return "counts: array expected";
                for (let i = 0; i < message.counts.length; ++i)
                    if (typeof message.counts[i] !== "number")
                        return "counts: number[] expected";
            }
            return null;
        };

        /**
         * Creates a MassRadius message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.MassRadius
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.MassRadius} MassRadius
         */
        MassRadius.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.MassRadius)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.MassRadius: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.MassRadius();
            if (object.radii) {
                if (!$Array.isArray(object.radii))
                    throw $TypeError(".tendril.MassRadius.radii: array expected");
                message.radii = $Array(object.radii.length);
                for (let i = 0; i < object.radii.length; ++i)
                    message.radii[i] = $Number(object.radii[i]);
            }
            if (object.counts) {
                if (!$Array.isArray(object.counts))
                    throw $TypeError(".tendril.MassRadius.counts: array expected");
                message.counts = $Array(object.counts.length);
                for (let i = 0; i < object.counts.length; ++i)
                    message.counts[i] = $Number(object.counts[i]);
            }
            return message;
        };

        /**
         * Creates a plain object from a MassRadius message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.MassRadius
         * @static
         * @param {tendril.MassRadius} message MassRadius
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        MassRadius.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.arrays || options.defaults) {
                object.radii = [];
                object.counts = [];
            }
            if (message.radii && message.radii.length) {
                object.radii = $Array(message.radii.length);
                for (let j = 0; j < message.radii.length; ++j)
                    object.radii[j] = options.json && !$isFinite(message.radii[j]) ? $String(message.radii[j]) : message.radii[j];
            }
            if (message.counts && message.counts.length) {
                object.counts = $Array(message.counts.length);
                for (let j = 0; j < message.counts.length; ++j)
                    object.counts[j] = options.json && !$isFinite(message.counts[j]) ? $String(message.counts[j]) : message.counts[j];
            }
            return object;
        };

        /**
         * Converts this MassRadius to JSON.
         * @function toJSON
         * @memberof tendril.MassRadius
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        MassRadius.prototype.toJSON = function() {
            return MassRadius.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for MassRadius
         * @function getTypeUrl
         * @memberof tendril.MassRadius
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        MassRadius.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.MassRadius";
        };

        return MassRadius;
    })();

    tendril.GrowthCounters = (function() {

        /**
         * Properties of a GrowthCounters.
         * @typedef {Object} tendril.GrowthCounters.$Properties
         * @property {number|null} [jumps] GrowthCounters jumps
         * @property {number|null} [shortSteps] GrowthCounters shortSteps
         * @property {number|null} [returns] GrowthCounters returns
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a GrowthCounters.
         * @memberof tendril
         * @interface IGrowthCounters
         * @augments tendril.GrowthCounters.$Properties
         * @deprecated Use tendril.GrowthCounters.$Properties instead.
         */

        /**
         * Shape of a GrowthCounters.
         * @typedef {tendril.GrowthCounters.$Properties} tendril.GrowthCounters.$Shape
         */

        /**
         * Constructs a new GrowthCounters.
         * @memberof tendril
         * @classdesc Represents a GrowthCounters.
         * @constructor
         * @param {tendril.GrowthCounters.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const GrowthCounters = function (properties) {
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * GrowthCounters jumps.
         * @member {number} jumps
         * @memberof tendril.GrowthCounters
         * @instance
         */
        GrowthCounters.prototype.jumps = 0;

        /**
         * GrowthCounters shortSteps.
         * @member {number} shortSteps
         * @memberof tendril.GrowthCounters
         * @instance
         */
        GrowthCounters.prototype.shortSteps = 0;

        /**
         * GrowthCounters returns.
         * @member {number} returns
         * @memberof tendril.GrowthCounters
         * @instance
         */
        GrowthCounters.prototype.returns = 0;

        /**
         * Creates a new GrowthCounters instance using the specified properties.
         * @function create
         * @memberof tendril.GrowthCounters
         * @static
         * @param {tendril.GrowthCounters.$Properties=} [properties] Properties to set
         * @returns {tendril.GrowthCounters} GrowthCounters instance
         * @type {{
         *   (properties: tendril.GrowthCounters.$Shape): tendril.GrowthCounters & tendril.GrowthCounters.$Shape;
         *   (properties?: tendril.GrowthCounters.$Properties): tendril.GrowthCounters;
         * }}
         */
        GrowthCounters.create = function(properties) {
            return new GrowthCounters(properties);
        };

        /**
         * Encodes the specified GrowthCounters message. Does not implicitly {@link tendril.GrowthCounters.verify|verify} messages.
         * @function encode
         * @memberof tendril.GrowthCounters
         * @static
         * @param {tendril.GrowthCounters.$Properties} message GrowthCounters message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        GrowthCounters.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.jumps != null && $Object.hasOwnProperty.call(message, "jumps") && !$Object.is(message.jumps, 0))
                writer.uint32(/* id 1, wireType 1 =*/9).double(message.jumps);
            if (message.shortSteps != null && $Object.hasOwnProperty.call(message, "shortSteps") && !$Object.is(message.shortSteps, 0))
                writer.uint32(/* id 2, wireType 1 =*/17).double(message.shortSteps);
            if (message.returns != null && $Object.hasOwnProperty.call(message, "returns") && !$Object.is(message.returns, 0))
                writer.uint32(/* id 3, wireType 1 =*/25).double(message.returns);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified GrowthCounters message, length delimited. Does not implicitly {@link tendril.GrowthCounters.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.GrowthCounters
         * @static
         * @param {tendril.GrowthCounters.$Properties} message GrowthCounters message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        GrowthCounters.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a GrowthCounters message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.GrowthCounters
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.GrowthCounters & tendril.GrowthCounters.$Shape} GrowthCounters
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        GrowthCounters.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.GrowthCounters();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.jumps = value;
                        else
                            delete message.jumps;
                        continue;
                    }
                case 2: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.shortSteps = value;
                        else
                            delete message.shortSteps;
                        continue;
                    }
                case 3: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.returns = value;
                        else
                            delete message.returns;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a GrowthCounters message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.GrowthCounters
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.GrowthCounters & tendril.GrowthCounters.$Shape} GrowthCounters
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        GrowthCounters.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a GrowthCounters message.
         * @function verify
         * @memberof tendril.GrowthCounters
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        GrowthCounters.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.jumps != null && $Object.hasOwnProperty.call(message, "jumps"))
                if (typeof message.jumps !== "number")
                    return "jumps: number expected";
            if (message.shortSteps != null && $Object.hasOwnProperty.call(message, "shortSteps"))
                if (typeof message.shortSteps !== "number")
                    return "shortSteps: number expected";
            if (message.returns != null && $Object.hasOwnProperty.call(message, "returns"))
                if (typeof message.returns !== "number")
                    return "returns: number expected";
            return null;
        };

        /**
         * Creates a GrowthCounters message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.GrowthCounters
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.GrowthCounters} GrowthCounters
         */
        GrowthCounters.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.GrowthCounters)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.GrowthCounters: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.GrowthCounters();
            if (object.jumps != null)
                if (!$Object.is($Number(object.jumps), 0))
                    message.jumps = $Number(object.jumps);
            if (object.shortSteps != null)
                if (!$Object.is($Number(object.shortSteps), 0))
                    message.shortSteps = $Number(object.shortSteps);
            if (object.returns != null)
                if (!$Object.is($Number(object.returns), 0))
                    message.returns = $Number(object.returns);
            return message;
        };

        /**
         * Creates a plain object from a GrowthCounters message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.GrowthCounters
         * @static
         * @param {tendril.GrowthCounters} message GrowthCounters
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        GrowthCounters.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.defaults) {
                object.jumps = 0;
                object.shortSteps = 0;
                object.returns = 0;
            }
            if (message.jumps != null && $Object.hasOwnProperty.call(message, "jumps"))
                object.jumps = options.json && !$isFinite(message.jumps) ? $String(message.jumps) : message.jumps;
            if (message.shortSteps != null && $Object.hasOwnProperty.call(message, "shortSteps"))
                object.shortSteps = options.json && !$isFinite(message.shortSteps) ? $String(message.shortSteps) : message.shortSteps;
            if (message.returns != null && $Object.hasOwnProperty.call(message, "returns"))
                object.returns = options.json && !$isFinite(message.returns) ? $String(message.returns) : message.returns;
            return object;
        };

        /**
         * Converts this GrowthCounters to JSON.
         * @function toJSON
         * @memberof tendril.GrowthCounters
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        GrowthCounters.prototype.toJSON = function() {
            return GrowthCounters.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for GrowthCounters
         * @function getTypeUrl
         * @memberof tendril.GrowthCounters
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        GrowthCounters.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.GrowthCounters";
        };

        return GrowthCounters;
    })();

    tendril.RunTimings = (function() {

        /**
         * Properties of a RunTimings.
         * @typedef {Object} tendril.RunTimings.$Properties
         * @property {number|null} [growSeconds] RunTimings growSeconds
         * @property {number|null} [startedAtMs] RunTimings startedAtMs
         * @property {number|null} [finishedAtMs] RunTimings finishedAtMs
         * @property {number|null} [resumes] RunTimings resumes
         * @property {string|null} [finishedBy] RunTimings finishedBy
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a RunTimings.
         * @memberof tendril
         * @interface IRunTimings
         * @augments tendril.RunTimings.$Properties
         * @deprecated Use tendril.RunTimings.$Properties instead.
         */

        /**
         * Shape of a RunTimings.
         * @typedef {tendril.RunTimings.$Properties} tendril.RunTimings.$Shape
         */

        /**
         * Constructs a new RunTimings.
         * @memberof tendril
         * @classdesc Represents a RunTimings.
         * @constructor
         * @param {tendril.RunTimings.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const RunTimings = function (properties) {
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * RunTimings growSeconds.
         * @member {number} growSeconds
         * @memberof tendril.RunTimings
         * @instance
         */
        RunTimings.prototype.growSeconds = 0;

        /**
         * RunTimings startedAtMs.
         * @member {number} startedAtMs
         * @memberof tendril.RunTimings
         * @instance
         */
        RunTimings.prototype.startedAtMs = 0;

        /**
         * RunTimings finishedAtMs.
         * @member {number} finishedAtMs
         * @memberof tendril.RunTimings
         * @instance
         */
        RunTimings.prototype.finishedAtMs = 0;

        /**
         * RunTimings resumes.
         * @member {number} resumes
         * @memberof tendril.RunTimings
         * @instance
         */
        RunTimings.prototype.resumes = 0;

        /**
         * RunTimings finishedBy.
         * @member {string} finishedBy
         * @memberof tendril.RunTimings
         * @instance
         */
        RunTimings.prototype.finishedBy = "";

        /**
         * Creates a new RunTimings instance using the specified properties.
         * @function create
         * @memberof tendril.RunTimings
         * @static
         * @param {tendril.RunTimings.$Properties=} [properties] Properties to set
         * @returns {tendril.RunTimings} RunTimings instance
         * @type {{
         *   (properties: tendril.RunTimings.$Shape): tendril.RunTimings & tendril.RunTimings.$Shape;
         *   (properties?: tendril.RunTimings.$Properties): tendril.RunTimings;
         * }}
         */
        RunTimings.create = function(properties) {
            return new RunTimings(properties);
        };

        /**
         * Encodes the specified RunTimings message. Does not implicitly {@link tendril.RunTimings.verify|verify} messages.
         * @function encode
         * @memberof tendril.RunTimings
         * @static
         * @param {tendril.RunTimings.$Properties} message RunTimings message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        RunTimings.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.growSeconds != null && $Object.hasOwnProperty.call(message, "growSeconds") && !$Object.is(message.growSeconds, 0))
                writer.uint32(/* id 1, wireType 1 =*/9).double(message.growSeconds);
            if (message.startedAtMs != null && $Object.hasOwnProperty.call(message, "startedAtMs") && !$Object.is(message.startedAtMs, 0))
                writer.uint32(/* id 2, wireType 1 =*/17).double(message.startedAtMs);
            if (message.finishedAtMs != null && $Object.hasOwnProperty.call(message, "finishedAtMs") && !$Object.is(message.finishedAtMs, 0))
                writer.uint32(/* id 3, wireType 1 =*/25).double(message.finishedAtMs);
            if (message.resumes != null && $Object.hasOwnProperty.call(message, "resumes") && message.resumes !== 0)
                writer.uint32(/* id 4, wireType 0 =*/32).uint32(message.resumes);
            if (message.finishedBy != null && $Object.hasOwnProperty.call(message, "finishedBy") && message.finishedBy !== "")
                writer.uint32(/* id 5, wireType 2 =*/42).string(message.finishedBy);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified RunTimings message, length delimited. Does not implicitly {@link tendril.RunTimings.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.RunTimings
         * @static
         * @param {tendril.RunTimings.$Properties} message RunTimings message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        RunTimings.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a RunTimings message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.RunTimings
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.RunTimings & tendril.RunTimings.$Shape} RunTimings
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        RunTimings.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.RunTimings();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.growSeconds = value;
                        else
                            delete message.growSeconds;
                        continue;
                    }
                case 2: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.startedAtMs = value;
                        else
                            delete message.startedAtMs;
                        continue;
                    }
                case 3: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.finishedAtMs = value;
                        else
                            delete message.finishedAtMs;
                        continue;
                    }
                case 4: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.resumes = value;
                        else
                            delete message.resumes;
                        continue;
                    }
                case 5: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.finishedBy = value;
                        else
                            delete message.finishedBy;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a RunTimings message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.RunTimings
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.RunTimings & tendril.RunTimings.$Shape} RunTimings
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        RunTimings.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a RunTimings message.
         * @function verify
         * @memberof tendril.RunTimings
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        RunTimings.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.growSeconds != null && $Object.hasOwnProperty.call(message, "growSeconds"))
                if (typeof message.growSeconds !== "number")
                    return "growSeconds: number expected";
            if (message.startedAtMs != null && $Object.hasOwnProperty.call(message, "startedAtMs"))
                if (typeof message.startedAtMs !== "number")
                    return "startedAtMs: number expected";
            if (message.finishedAtMs != null && $Object.hasOwnProperty.call(message, "finishedAtMs"))
                if (typeof message.finishedAtMs !== "number")
                    return "finishedAtMs: number expected";
            if (message.resumes != null && $Object.hasOwnProperty.call(message, "resumes"))
                if (!$util.isInteger(message.resumes))
                    return "resumes: integer expected";
            if (message.finishedBy != null && $Object.hasOwnProperty.call(message, "finishedBy"))
                if (!$util.isString(message.finishedBy))
                    return "finishedBy: string expected";
            return null;
        };

        /**
         * Creates a RunTimings message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.RunTimings
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.RunTimings} RunTimings
         */
        RunTimings.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.RunTimings)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.RunTimings: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.RunTimings();
            if (object.growSeconds != null)
                if (!$Object.is($Number(object.growSeconds), 0))
                    message.growSeconds = $Number(object.growSeconds);
            if (object.startedAtMs != null)
                if (!$Object.is($Number(object.startedAtMs), 0))
                    message.startedAtMs = $Number(object.startedAtMs);
            if (object.finishedAtMs != null)
                if (!$Object.is($Number(object.finishedAtMs), 0))
                    message.finishedAtMs = $Number(object.finishedAtMs);
            if (object.resumes != null)
                if ($Number(object.resumes) !== 0)
                    message.resumes = object.resumes >>> 0;
            if (object.finishedBy != null)
                if (typeof object.finishedBy !== "string" || object.finishedBy.length)
                    message.finishedBy = $String(object.finishedBy);
            return message;
        };

        /**
         * Creates a plain object from a RunTimings message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.RunTimings
         * @static
         * @param {tendril.RunTimings} message RunTimings
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        RunTimings.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.defaults) {
                object.growSeconds = 0;
                object.startedAtMs = 0;
                object.finishedAtMs = 0;
                object.resumes = 0;
                object.finishedBy = "";
            }
            if (message.growSeconds != null && $Object.hasOwnProperty.call(message, "growSeconds"))
                object.growSeconds = options.json && !$isFinite(message.growSeconds) ? $String(message.growSeconds) : message.growSeconds;
            if (message.startedAtMs != null && $Object.hasOwnProperty.call(message, "startedAtMs"))
                object.startedAtMs = options.json && !$isFinite(message.startedAtMs) ? $String(message.startedAtMs) : message.startedAtMs;
            if (message.finishedAtMs != null && $Object.hasOwnProperty.call(message, "finishedAtMs"))
                object.finishedAtMs = options.json && !$isFinite(message.finishedAtMs) ? $String(message.finishedAtMs) : message.finishedAtMs;
            if (message.resumes != null && $Object.hasOwnProperty.call(message, "resumes"))
                object.resumes = message.resumes;
            if (message.finishedBy != null && $Object.hasOwnProperty.call(message, "finishedBy"))
                object.finishedBy = message.finishedBy;
            return object;
        };

        /**
         * Converts this RunTimings to JSON.
         * @function toJSON
         * @memberof tendril.RunTimings
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        RunTimings.prototype.toJSON = function() {
            return RunTimings.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for RunTimings
         * @function getTypeUrl
         * @memberof tendril.RunTimings
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        RunTimings.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.RunTimings";
        };

        return RunTimings;
    })();

    tendril.RunResult = (function() {

        /**
         * Properties of a RunResult.
         * @typedef {Object} tendril.RunResult.$Properties
         * @property {number|null} [contractVersion] RunResult contractVersion
         * @property {string|null} [ensembleId] RunResult ensembleId
         * @property {number|null} [runIndex] RunResult runIndex
         * @property {string|null} [engineVersion] RunResult engineVersion
         * @property {tendril.ModelParams.$Properties|null} [model] RunResult model
         * @property {number|null} [particles] RunResult particles
         * @property {string|null} [ensembleSeed] RunResult ensembleSeed
         * @property {tendril.GrowthSeries.$Properties|null} [series] RunResult series
         * @property {tendril.MassRadius.$Properties|null} [massRadius] RunResult massRadius
         * @property {tendril.GrowthCounters.$Properties|null} [counters] RunResult counters
         * @property {string|null} [stateHash] RunResult stateHash
         * @property {tendril.RunTimings.$Properties|null} [timings] RunResult timings
         * @property {Object.<string,number>|null} [counterValues] RunResult counterValues
         * @property {number|null} [dimension] RunResult dimension
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a RunResult.
         * @memberof tendril
         * @interface IRunResult
         * @augments tendril.RunResult.$Properties
         * @deprecated Use tendril.RunResult.$Properties instead.
         */

        /**
         * Shape of a RunResult.
         * @typedef {{
         *   contractVersion?: number|null;
         *   ensembleId?: string|null;
         *   runIndex?: number|null;
         *   engineVersion?: string|null;
         *   model?: tendril.ModelParams.$Shape|null;
         *   particles?: number|null;
         *   ensembleSeed?: string|null;
         *   series?: tendril.GrowthSeries.$Shape|null;
         *   massRadius?: tendril.MassRadius.$Shape|null;
         *   counters?: tendril.GrowthCounters.$Shape|null;
         *   stateHash?: string|null;
         *   timings?: tendril.RunTimings.$Shape|null;
         *   counterValues?: Object.<string,number>|null;
         *   dimension?: number|null;
         *   $unknowns?: Array.<Uint8Array>;
         * }} tendril.RunResult.$Shape
         */

        /**
         * Constructs a new RunResult.
         * @memberof tendril
         * @classdesc Represents a RunResult.
         * @constructor
         * @param {tendril.RunResult.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const RunResult = function (properties) {
            this.counterValues = {};
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * RunResult contractVersion.
         * @member {number} contractVersion
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.contractVersion = 0;

        /**
         * RunResult ensembleId.
         * @member {string} ensembleId
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.ensembleId = "";

        /**
         * RunResult runIndex.
         * @member {number} runIndex
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.runIndex = 0;

        /**
         * RunResult engineVersion.
         * @member {string} engineVersion
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.engineVersion = "";

        /**
         * RunResult model.
         * @member {tendril.ModelParams.$Properties|null|undefined} model
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.model = null;

        /**
         * RunResult particles.
         * @member {number} particles
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.particles = 0;

        /**
         * RunResult ensembleSeed.
         * @member {string} ensembleSeed
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.ensembleSeed = "";

        /**
         * RunResult series.
         * @member {tendril.GrowthSeries.$Properties|null|undefined} series
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.series = null;

        /**
         * RunResult massRadius.
         * @member {tendril.MassRadius.$Properties|null|undefined} massRadius
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.massRadius = null;

        /**
         * RunResult counters.
         * @member {tendril.GrowthCounters.$Properties|null|undefined} counters
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.counters = null;

        /**
         * RunResult stateHash.
         * @member {string} stateHash
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.stateHash = "";

        /**
         * RunResult timings.
         * @member {tendril.RunTimings.$Properties|null|undefined} timings
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.timings = null;

        /**
         * RunResult counterValues.
         * @member {Object.<string,number>} counterValues
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.counterValues = $util.emptyObject;

        /**
         * RunResult dimension.
         * @member {number} dimension
         * @memberof tendril.RunResult
         * @instance
         */
        RunResult.prototype.dimension = 0;

        /**
         * Creates a new RunResult instance using the specified properties.
         * @function create
         * @memberof tendril.RunResult
         * @static
         * @param {tendril.RunResult.$Properties=} [properties] Properties to set
         * @returns {tendril.RunResult} RunResult instance
         * @type {{
         *   (properties: tendril.RunResult.$Shape): tendril.RunResult & tendril.RunResult.$Shape;
         *   (properties?: tendril.RunResult.$Properties): tendril.RunResult;
         * }}
         */
        RunResult.create = function(properties) {
            return new RunResult(properties);
        };

        /**
         * Encodes the specified RunResult message. Does not implicitly {@link tendril.RunResult.verify|verify} messages.
         * @function encode
         * @memberof tendril.RunResult
         * @static
         * @param {tendril.RunResult.$Properties} message RunResult message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        RunResult.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion") && message.contractVersion !== 0)
                writer.uint32(/* id 1, wireType 0 =*/8).uint32(message.contractVersion);
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId") && message.ensembleId !== "")
                writer.uint32(/* id 2, wireType 2 =*/18).string(message.ensembleId);
            if (message.runIndex != null && $Object.hasOwnProperty.call(message, "runIndex") && message.runIndex !== 0)
                writer.uint32(/* id 3, wireType 0 =*/24).uint32(message.runIndex);
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion") && message.engineVersion !== "")
                writer.uint32(/* id 4, wireType 2 =*/34).string(message.engineVersion);
            if (message.model != null && $Object.hasOwnProperty.call(message, "model"))
                $root.tendril.ModelParams.encode(message.model, writer.uint32(/* id 5, wireType 2 =*/42).fork(), _depth + 1).ldelim();
            if (message.particles != null && $Object.hasOwnProperty.call(message, "particles") && message.particles !== 0)
                writer.uint32(/* id 6, wireType 0 =*/48).uint32(message.particles);
            if (message.ensembleSeed != null && $Object.hasOwnProperty.call(message, "ensembleSeed") && message.ensembleSeed !== "")
                writer.uint32(/* id 7, wireType 2 =*/58).string(message.ensembleSeed);
            if (message.series != null && $Object.hasOwnProperty.call(message, "series"))
                $root.tendril.GrowthSeries.encode(message.series, writer.uint32(/* id 8, wireType 2 =*/66).fork(), _depth + 1).ldelim();
            if (message.massRadius != null && $Object.hasOwnProperty.call(message, "massRadius"))
                $root.tendril.MassRadius.encode(message.massRadius, writer.uint32(/* id 9, wireType 2 =*/74).fork(), _depth + 1).ldelim();
            if (message.counters != null && $Object.hasOwnProperty.call(message, "counters"))
                $root.tendril.GrowthCounters.encode(message.counters, writer.uint32(/* id 10, wireType 2 =*/82).fork(), _depth + 1).ldelim();
            if (message.stateHash != null && $Object.hasOwnProperty.call(message, "stateHash") && message.stateHash !== "")
                writer.uint32(/* id 11, wireType 2 =*/90).string(message.stateHash);
            if (message.timings != null && $Object.hasOwnProperty.call(message, "timings"))
                $root.tendril.RunTimings.encode(message.timings, writer.uint32(/* id 12, wireType 2 =*/98).fork(), _depth + 1).ldelim();
            if (message.counterValues != null && $Object.hasOwnProperty.call(message, "counterValues"))
                for (let keys = $Object.keys(message.counterValues), i = 0; i < keys.length; ++i)
                    writer.uint32(/* id 13, wireType 2 =*/106).fork().uint32(/* id 1, wireType 2 =*/10).string(keys[i]).uint32(/* id 2, wireType 1 =*/17).double(message.counterValues[keys[i]]).ldelim();
            if (message.dimension != null && $Object.hasOwnProperty.call(message, "dimension") && message.dimension !== 0)
                writer.uint32(/* id 14, wireType 0 =*/112).uint32(message.dimension);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified RunResult message, length delimited. Does not implicitly {@link tendril.RunResult.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.RunResult
         * @static
         * @param {tendril.RunResult.$Properties} message RunResult message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        RunResult.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a RunResult message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.RunResult
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.RunResult & tendril.RunResult.$Shape} RunResult
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        RunResult.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, key, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.RunResult();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.contractVersion = value;
                        else
                            delete message.contractVersion;
                        continue;
                    }
                case 2: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.ensembleId = value;
                        else
                            delete message.ensembleId;
                        continue;
                    }
                case 3: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.runIndex = value;
                        else
                            delete message.runIndex;
                        continue;
                    }
                case 4: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.engineVersion = value;
                        else
                            delete message.engineVersion;
                        continue;
                    }
                case 5: {
                        if (wireType !== 2)
                            break;
                        message.model = $root.tendril.ModelParams.decode(reader, reader.size(), $undefined, _depth + 1, message.model);
                        continue;
                    }
                case 6: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.particles = value;
                        else
                            delete message.particles;
                        continue;
                    }
                case 7: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.ensembleSeed = value;
                        else
                            delete message.ensembleSeed;
                        continue;
                    }
                case 8: {
                        if (wireType !== 2)
                            break;
                        message.series = $root.tendril.GrowthSeries.decode(reader, reader.size(), $undefined, _depth + 1, message.series);
                        continue;
                    }
                case 9: {
                        if (wireType !== 2)
                            break;
                        message.massRadius = $root.tendril.MassRadius.decode(reader, reader.size(), $undefined, _depth + 1, message.massRadius);
                        continue;
                    }
                case 10: {
                        if (wireType !== 2)
                            break;
                        message.counters = $root.tendril.GrowthCounters.decode(reader, reader.size(), $undefined, _depth + 1, message.counters);
                        continue;
                    }
                case 11: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.stateHash = value;
                        else
                            delete message.stateHash;
                        continue;
                    }
                case 12: {
                        if (wireType !== 2)
                            break;
                        message.timings = $root.tendril.RunTimings.decode(reader, reader.size(), $undefined, _depth + 1, message.timings);
                        continue;
                    }
                case 13: {
                        if (wireType !== 2)
                            break;
                        if (message.counterValues === $util.emptyObject)
                            message.counterValues = {};
                        let end2 = reader.size() + reader.pos;
                        if (end2 > reader.len)
                            throw $RangeError("index out of range");
                        reader.len = end2;
                        key = "";
                        value = 0;
                        while (reader.pos < end2) {
                            let tag2 = reader.tag();
                            wireType = tag2 & 7;
                            switch (tag2 >>>= 3) {
                            case 1:
                                if (wireType !== 2)
                                    break;
                                key = reader.stringVerify();
                                continue;
                            case 2:
                                if (wireType !== 1)
                                    break;
                                value = reader.double();
                                continue;
                            }
                            reader.skipType(wireType, _depth, tag2);
                        }
                        if (reader.pos !== end2)
                            throw $RangeError("index out of range");
                        reader.len = end;
                        if (key === "__proto__")
                            $util.makeProp(message.counterValues, key);
                        message.counterValues[key] = value;
                        continue;
                    }
                case 14: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.dimension = value;
                        else
                            delete message.dimension;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a RunResult message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.RunResult
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.RunResult & tendril.RunResult.$Shape} RunResult
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        RunResult.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a RunResult message.
         * @function verify
         * @memberof tendril.RunResult
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        RunResult.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion"))
                if (!$util.isInteger(message.contractVersion))
                    return "contractVersion: integer expected";
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId"))
                if (!$util.isString(message.ensembleId))
                    return "ensembleId: string expected";
            if (message.runIndex != null && $Object.hasOwnProperty.call(message, "runIndex"))
                if (!$util.isInteger(message.runIndex))
                    return "runIndex: integer expected";
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion"))
                if (!$util.isString(message.engineVersion))
                    return "engineVersion: string expected";
            if (message.model != null && $Object.hasOwnProperty.call(message, "model")) {
                let error = $root.tendril.ModelParams.verify(message.model, _depth + 1);
                if (error)
                    return "model." + error;
            }
            if (message.particles != null && $Object.hasOwnProperty.call(message, "particles"))
                if (!$util.isInteger(message.particles))
                    return "particles: integer expected";
            if (message.ensembleSeed != null && $Object.hasOwnProperty.call(message, "ensembleSeed"))
                if (!$util.isString(message.ensembleSeed))
                    return "ensembleSeed: string expected";
            if (message.series != null && $Object.hasOwnProperty.call(message, "series")) {
                let error = $root.tendril.GrowthSeries.verify(message.series, _depth + 1);
                if (error)
                    return "series." + error;
            }
            if (message.massRadius != null && $Object.hasOwnProperty.call(message, "massRadius")) {
                let error = $root.tendril.MassRadius.verify(message.massRadius, _depth + 1);
                if (error)
                    return "massRadius." + error;
            }
            if (message.counters != null && $Object.hasOwnProperty.call(message, "counters")) {
                let error = $root.tendril.GrowthCounters.verify(message.counters, _depth + 1);
                if (error)
                    return "counters." + error;
            }
            if (message.stateHash != null && $Object.hasOwnProperty.call(message, "stateHash"))
                if (!$util.isString(message.stateHash))
                    return "stateHash: string expected";
            if (message.timings != null && $Object.hasOwnProperty.call(message, "timings")) {
                let error = $root.tendril.RunTimings.verify(message.timings, _depth + 1);
                if (error)
                    return "timings." + error;
            }
            if (message.counterValues != null && $Object.hasOwnProperty.call(message, "counterValues")) {
                if (!$util.isObject(message.counterValues))
                    return "counterValues: object expected";
                let key = $Object.keys(message.counterValues);
                for (let i = 0; i < key.length; ++i)
                    if (typeof message.counterValues[key[i]] !== "number")
                        return "counterValues: number{k:string} expected";
            }
            if (message.dimension != null && $Object.hasOwnProperty.call(message, "dimension"))
                if (!$util.isInteger(message.dimension))
                    return "dimension: integer expected";
            return null;
        };

        /**
         * Creates a RunResult message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.RunResult
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.RunResult} RunResult
         */
        RunResult.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.RunResult)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.RunResult: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.RunResult();
            if (object.contractVersion != null)
                if ($Number(object.contractVersion) !== 0)
                    message.contractVersion = object.contractVersion >>> 0;
            if (object.ensembleId != null)
                if (typeof object.ensembleId !== "string" || object.ensembleId.length)
                    message.ensembleId = $String(object.ensembleId);
            if (object.runIndex != null)
                if ($Number(object.runIndex) !== 0)
                    message.runIndex = object.runIndex >>> 0;
            if (object.engineVersion != null)
                if (typeof object.engineVersion !== "string" || object.engineVersion.length)
                    message.engineVersion = $String(object.engineVersion);
            if (object.model != null) {
                if (!$util.isObject(object.model))
                    throw $TypeError(".tendril.RunResult.model: object expected");
                message.model = $root.tendril.ModelParams.fromObject(object.model, _depth + 1);
            }
            if (object.particles != null)
                if ($Number(object.particles) !== 0)
                    message.particles = object.particles >>> 0;
            if (object.ensembleSeed != null)
                if (typeof object.ensembleSeed !== "string" || object.ensembleSeed.length)
                    message.ensembleSeed = $String(object.ensembleSeed);
            if (object.series != null) {
                if (!$util.isObject(object.series))
                    throw $TypeError(".tendril.RunResult.series: object expected");
                message.series = $root.tendril.GrowthSeries.fromObject(object.series, _depth + 1);
            }
            if (object.massRadius != null) {
                if (!$util.isObject(object.massRadius))
                    throw $TypeError(".tendril.RunResult.massRadius: object expected");
                message.massRadius = $root.tendril.MassRadius.fromObject(object.massRadius, _depth + 1);
            }
            if (object.counters != null) {
                if (!$util.isObject(object.counters))
                    throw $TypeError(".tendril.RunResult.counters: object expected");
                message.counters = $root.tendril.GrowthCounters.fromObject(object.counters, _depth + 1);
            }
            if (object.stateHash != null)
                if (typeof object.stateHash !== "string" || object.stateHash.length)
                    message.stateHash = $String(object.stateHash);
            if (object.timings != null) {
                if (!$util.isObject(object.timings))
                    throw $TypeError(".tendril.RunResult.timings: object expected");
                message.timings = $root.tendril.RunTimings.fromObject(object.timings, _depth + 1);
            }
            if (object.counterValues) {
                if (!$util.isObject(object.counterValues))
                    throw $TypeError(".tendril.RunResult.counterValues: object expected");
                message.counterValues = {};
                for (let keys = $Object.keys(object.counterValues), i = 0; i < keys.length; ++i) {
                    if (keys[i] === "__proto__")
                        $util.makeProp(message.counterValues, keys[i]);
                    message.counterValues[keys[i]] = $Number(object.counterValues[keys[i]]);
                }
            }
            if (object.dimension != null)
                if ($Number(object.dimension) !== 0)
                    message.dimension = object.dimension >>> 0;
            return message;
        };

        /**
         * Creates a plain object from a RunResult message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.RunResult
         * @static
         * @param {tendril.RunResult} message RunResult
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        RunResult.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.objects || options.defaults)
                object.counterValues = {};
            if (options.defaults) {
                object.contractVersion = 0;
                object.ensembleId = "";
                object.runIndex = 0;
                object.engineVersion = "";
                object.model = null;
                object.particles = 0;
                object.ensembleSeed = "";
                object.series = null;
                object.massRadius = null;
                object.counters = null;
                object.stateHash = "";
                object.timings = null;
                object.dimension = 0;
            }
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion"))
                object.contractVersion = message.contractVersion;
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId"))
                object.ensembleId = message.ensembleId;
            if (message.runIndex != null && $Object.hasOwnProperty.call(message, "runIndex"))
                object.runIndex = message.runIndex;
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion"))
                object.engineVersion = message.engineVersion;
            if (message.model != null && $Object.hasOwnProperty.call(message, "model"))
                object.model = $root.tendril.ModelParams.toObject(message.model, options, _depth + 1);
            if (message.particles != null && $Object.hasOwnProperty.call(message, "particles"))
                object.particles = message.particles;
            if (message.ensembleSeed != null && $Object.hasOwnProperty.call(message, "ensembleSeed"))
                object.ensembleSeed = message.ensembleSeed;
            if (message.series != null && $Object.hasOwnProperty.call(message, "series"))
                object.series = $root.tendril.GrowthSeries.toObject(message.series, options, _depth + 1);
            if (message.massRadius != null && $Object.hasOwnProperty.call(message, "massRadius"))
                object.massRadius = $root.tendril.MassRadius.toObject(message.massRadius, options, _depth + 1);
            if (message.counters != null && $Object.hasOwnProperty.call(message, "counters"))
                object.counters = $root.tendril.GrowthCounters.toObject(message.counters, options, _depth + 1);
            if (message.stateHash != null && $Object.hasOwnProperty.call(message, "stateHash"))
                object.stateHash = message.stateHash;
            if (message.timings != null && $Object.hasOwnProperty.call(message, "timings"))
                object.timings = $root.tendril.RunTimings.toObject(message.timings, options, _depth + 1);
            let keys2;
            if (message.counterValues && (keys2 = $Object.keys(message.counterValues)).length) {
                object.counterValues = {};
                for (let j = 0; j < keys2.length; ++j) {
                    if (keys2[j] === "__proto__")
                        $util.makeProp(object.counterValues, keys2[j]);
                    object.counterValues[keys2[j]] = options.json && !$isFinite(message.counterValues[keys2[j]]) ? $String(message.counterValues[keys2[j]]) : message.counterValues[keys2[j]];
                }
            }
            if (message.dimension != null && $Object.hasOwnProperty.call(message, "dimension"))
                object.dimension = message.dimension;
            return object;
        };

        /**
         * Converts this RunResult to JSON.
         * @function toJSON
         * @memberof tendril.RunResult
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        RunResult.prototype.toJSON = function() {
            return RunResult.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for RunResult
         * @function getTypeUrl
         * @memberof tendril.RunResult
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        RunResult.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.RunResult";
        };

        return RunResult;
    })();

    tendril.Checkpoint = (function() {

        /**
         * Properties of a Checkpoint.
         * @typedef {Object} tendril.Checkpoint.$Properties
         * @property {number|null} [contractVersion] Checkpoint contractVersion
         * @property {string|null} [engineVersion] Checkpoint engineVersion
         * @property {tendril.RunTask.$Properties|null} [task] Checkpoint task
         * @property {number|null} [count] Checkpoint count
         * @property {Uint8Array|null} [x] Checkpoint x
         * @property {Uint8Array|null} [y] Checkpoint y
         * @property {Array.<number>|null} [rngState] Checkpoint rngState
         * @property {tendril.GrowthCounters.$Properties|null} [counters] Checkpoint counters
         * @property {tendril.GrowthSeries.$Properties|null} [series] Checkpoint series
         * @property {number|null} [growSeconds] Checkpoint growSeconds
         * @property {number|null} [startedAtMs] Checkpoint startedAtMs
         * @property {number|null} [resumes] Checkpoint resumes
         * @property {number|null} [dimension] Checkpoint dimension
         * @property {Uint8Array|null} [positions] Checkpoint positions
         * @property {Object.<string,number>|null} [counterValues] Checkpoint counterValues
         * @property {Uint8Array|null} [modelState] Checkpoint modelState
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a Checkpoint.
         * @memberof tendril
         * @interface ICheckpoint
         * @augments tendril.Checkpoint.$Properties
         * @deprecated Use tendril.Checkpoint.$Properties instead.
         */

        /**
         * Shape of a Checkpoint.
         * @typedef {{
         *   contractVersion?: number|null;
         *   engineVersion?: string|null;
         *   task?: tendril.RunTask.$Shape|null;
         *   count?: number|null;
         *   x?: Uint8Array|null;
         *   y?: Uint8Array|null;
         *   rngState?: Array.<number>|null;
         *   counters?: tendril.GrowthCounters.$Shape|null;
         *   series?: tendril.GrowthSeries.$Shape|null;
         *   growSeconds?: number|null;
         *   startedAtMs?: number|null;
         *   resumes?: number|null;
         *   dimension?: number|null;
         *   positions?: Uint8Array|null;
         *   counterValues?: Object.<string,number>|null;
         *   modelState?: Uint8Array|null;
         *   $unknowns?: Array.<Uint8Array>;
         * }} tendril.Checkpoint.$Shape
         */

        /**
         * Constructs a new Checkpoint.
         * @memberof tendril
         * @classdesc Represents a Checkpoint.
         * @constructor
         * @param {tendril.Checkpoint.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const Checkpoint = function (properties) {
            this.rngState = [];
            this.counterValues = {};
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * Checkpoint contractVersion.
         * @member {number} contractVersion
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.contractVersion = 0;

        /**
         * Checkpoint engineVersion.
         * @member {string} engineVersion
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.engineVersion = "";

        /**
         * Checkpoint task.
         * @member {tendril.RunTask.$Properties|null|undefined} task
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.task = null;

        /**
         * Checkpoint count.
         * @member {number} count
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.count = 0;

        /**
         * Checkpoint x.
         * @member {Uint8Array} x
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.x = $util.newBuffer([]);

        /**
         * Checkpoint y.
         * @member {Uint8Array} y
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.y = $util.newBuffer([]);

        /**
         * Checkpoint rngState.
         * @member {Array.<number>} rngState
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.rngState = $util.emptyArray;

        /**
         * Checkpoint counters.
         * @member {tendril.GrowthCounters.$Properties|null|undefined} counters
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.counters = null;

        /**
         * Checkpoint series.
         * @member {tendril.GrowthSeries.$Properties|null|undefined} series
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.series = null;

        /**
         * Checkpoint growSeconds.
         * @member {number} growSeconds
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.growSeconds = 0;

        /**
         * Checkpoint startedAtMs.
         * @member {number} startedAtMs
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.startedAtMs = 0;

        /**
         * Checkpoint resumes.
         * @member {number} resumes
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.resumes = 0;

        /**
         * Checkpoint dimension.
         * @member {number} dimension
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.dimension = 0;

        /**
         * Checkpoint positions.
         * @member {Uint8Array} positions
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.positions = $util.newBuffer([]);

        /**
         * Checkpoint counterValues.
         * @member {Object.<string,number>} counterValues
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.counterValues = $util.emptyObject;

        /**
         * Checkpoint modelState.
         * @member {Uint8Array} modelState
         * @memberof tendril.Checkpoint
         * @instance
         */
        Checkpoint.prototype.modelState = $util.newBuffer([]);

        /**
         * Creates a new Checkpoint instance using the specified properties.
         * @function create
         * @memberof tendril.Checkpoint
         * @static
         * @param {tendril.Checkpoint.$Properties=} [properties] Properties to set
         * @returns {tendril.Checkpoint} Checkpoint instance
         * @type {{
         *   (properties: tendril.Checkpoint.$Shape): tendril.Checkpoint & tendril.Checkpoint.$Shape;
         *   (properties?: tendril.Checkpoint.$Properties): tendril.Checkpoint;
         * }}
         */
        Checkpoint.create = function(properties) {
            return new Checkpoint(properties);
        };

        /**
         * Encodes the specified Checkpoint message. Does not implicitly {@link tendril.Checkpoint.verify|verify} messages.
         * @function encode
         * @memberof tendril.Checkpoint
         * @static
         * @param {tendril.Checkpoint.$Properties} message Checkpoint message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        Checkpoint.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion") && message.contractVersion !== 0)
                writer.uint32(/* id 1, wireType 0 =*/8).uint32(message.contractVersion);
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion") && message.engineVersion !== "")
                writer.uint32(/* id 2, wireType 2 =*/18).string(message.engineVersion);
            if (message.task != null && $Object.hasOwnProperty.call(message, "task"))
                $root.tendril.RunTask.encode(message.task, writer.uint32(/* id 3, wireType 2 =*/26).fork(), _depth + 1).ldelim();
            if (message.count != null && $Object.hasOwnProperty.call(message, "count") && message.count !== 0)
                writer.uint32(/* id 4, wireType 0 =*/32).uint32(message.count);
            if (message.x != null && $Object.hasOwnProperty.call(message, "x") && message.x.length)
                writer.uint32(/* id 5, wireType 2 =*/42).bytes(message.x);
            if (message.y != null && $Object.hasOwnProperty.call(message, "y") && message.y.length)
                writer.uint32(/* id 6, wireType 2 =*/50).bytes(message.y);
            if (message.rngState != null && message.rngState.length)
                writer.uint32(/* id 7, wireType 2 =*/58).uint32s(message.rngState);
            if (message.counters != null && $Object.hasOwnProperty.call(message, "counters"))
                $root.tendril.GrowthCounters.encode(message.counters, writer.uint32(/* id 8, wireType 2 =*/66).fork(), _depth + 1).ldelim();
            if (message.series != null && $Object.hasOwnProperty.call(message, "series"))
                $root.tendril.GrowthSeries.encode(message.series, writer.uint32(/* id 9, wireType 2 =*/74).fork(), _depth + 1).ldelim();
            if (message.growSeconds != null && $Object.hasOwnProperty.call(message, "growSeconds") && !$Object.is(message.growSeconds, 0))
                writer.uint32(/* id 10, wireType 1 =*/81).double(message.growSeconds);
            if (message.startedAtMs != null && $Object.hasOwnProperty.call(message, "startedAtMs") && !$Object.is(message.startedAtMs, 0))
                writer.uint32(/* id 11, wireType 1 =*/89).double(message.startedAtMs);
            if (message.resumes != null && $Object.hasOwnProperty.call(message, "resumes") && message.resumes !== 0)
                writer.uint32(/* id 12, wireType 0 =*/96).uint32(message.resumes);
            if (message.dimension != null && $Object.hasOwnProperty.call(message, "dimension") && message.dimension !== 0)
                writer.uint32(/* id 13, wireType 0 =*/104).uint32(message.dimension);
            if (message.positions != null && $Object.hasOwnProperty.call(message, "positions") && message.positions.length)
                writer.uint32(/* id 14, wireType 2 =*/114).bytes(message.positions);
            if (message.counterValues != null && $Object.hasOwnProperty.call(message, "counterValues"))
                for (let keys = $Object.keys(message.counterValues), i = 0; i < keys.length; ++i)
                    writer.uint32(/* id 15, wireType 2 =*/122).fork().uint32(/* id 1, wireType 2 =*/10).string(keys[i]).uint32(/* id 2, wireType 1 =*/17).double(message.counterValues[keys[i]]).ldelim();
            if (message.modelState != null && $Object.hasOwnProperty.call(message, "modelState") && message.modelState.length)
                writer.uint32(/* id 16, wireType 2 =*/130).bytes(message.modelState);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified Checkpoint message, length delimited. Does not implicitly {@link tendril.Checkpoint.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.Checkpoint
         * @static
         * @param {tendril.Checkpoint.$Properties} message Checkpoint message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        Checkpoint.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a Checkpoint message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.Checkpoint
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.Checkpoint & tendril.Checkpoint.$Shape} Checkpoint
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        Checkpoint.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, key, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.Checkpoint();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.contractVersion = value;
                        else
                            delete message.contractVersion;
                        continue;
                    }
                case 2: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.engineVersion = value;
                        else
                            delete message.engineVersion;
                        continue;
                    }
                case 3: {
                        if (wireType !== 2)
                            break;
                        message.task = $root.tendril.RunTask.decode(reader, reader.size(), $undefined, _depth + 1, message.task);
                        continue;
                    }
                case 4: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.count = value;
                        else
                            delete message.count;
                        continue;
                    }
                case 5: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.bytes()).length)
                            message.x = value;
                        else
                            delete message.x;
                        continue;
                    }
                case 6: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.bytes()).length)
                            message.y = value;
                        else
                            delete message.y;
                        continue;
                    }
                case 7: {
                        if (wireType === 2) {
                            if (!(message.rngState && message.rngState.length))
                                message.rngState = [];
                            reader.uint32s(message.rngState);
                            continue;
                        }
                        if (wireType !== 0)
                            break;
                        if (!(message.rngState && message.rngState.length))
                            message.rngState = [];
                        message.rngState.push(reader.uint32());
                        continue;
                    }
                case 8: {
                        if (wireType !== 2)
                            break;
                        message.counters = $root.tendril.GrowthCounters.decode(reader, reader.size(), $undefined, _depth + 1, message.counters);
                        continue;
                    }
                case 9: {
                        if (wireType !== 2)
                            break;
                        message.series = $root.tendril.GrowthSeries.decode(reader, reader.size(), $undefined, _depth + 1, message.series);
                        continue;
                    }
                case 10: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.growSeconds = value;
                        else
                            delete message.growSeconds;
                        continue;
                    }
                case 11: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.startedAtMs = value;
                        else
                            delete message.startedAtMs;
                        continue;
                    }
                case 12: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.resumes = value;
                        else
                            delete message.resumes;
                        continue;
                    }
                case 13: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.dimension = value;
                        else
                            delete message.dimension;
                        continue;
                    }
                case 14: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.bytes()).length)
                            message.positions = value;
                        else
                            delete message.positions;
                        continue;
                    }
                case 15: {
                        if (wireType !== 2)
                            break;
                        if (message.counterValues === $util.emptyObject)
                            message.counterValues = {};
                        let end2 = reader.size() + reader.pos;
                        if (end2 > reader.len)
                            throw $RangeError("index out of range");
                        reader.len = end2;
                        key = "";
                        value = 0;
                        while (reader.pos < end2) {
                            let tag2 = reader.tag();
                            wireType = tag2 & 7;
                            switch (tag2 >>>= 3) {
                            case 1:
                                if (wireType !== 2)
                                    break;
                                key = reader.stringVerify();
                                continue;
                            case 2:
                                if (wireType !== 1)
                                    break;
                                value = reader.double();
                                continue;
                            }
                            reader.skipType(wireType, _depth, tag2);
                        }
                        if (reader.pos !== end2)
                            throw $RangeError("index out of range");
                        reader.len = end;
                        if (key === "__proto__")
                            $util.makeProp(message.counterValues, key);
                        message.counterValues[key] = value;
                        continue;
                    }
                case 16: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.bytes()).length)
                            message.modelState = value;
                        else
                            delete message.modelState;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a Checkpoint message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.Checkpoint
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.Checkpoint & tendril.Checkpoint.$Shape} Checkpoint
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        Checkpoint.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a Checkpoint message.
         * @function verify
         * @memberof tendril.Checkpoint
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        Checkpoint.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion"))
                if (!$util.isInteger(message.contractVersion))
                    return "contractVersion: integer expected";
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion"))
                if (!$util.isString(message.engineVersion))
                    return "engineVersion: string expected";
            if (message.task != null && $Object.hasOwnProperty.call(message, "task")) {
                let error = $root.tendril.RunTask.verify(message.task, _depth + 1);
                if (error)
                    return "task." + error;
            }
            if (message.count != null && $Object.hasOwnProperty.call(message, "count"))
                if (!$util.isInteger(message.count))
                    return "count: integer expected";
            if (message.x != null && $Object.hasOwnProperty.call(message, "x"))
                if (!(message.x && typeof message.x.length === "number" || $util.isString(message.x)))
                    return "x: buffer expected";
            if (message.y != null && $Object.hasOwnProperty.call(message, "y"))
                if (!(message.y && typeof message.y.length === "number" || $util.isString(message.y)))
                    return "y: buffer expected";
            if (message.rngState != null && $Object.hasOwnProperty.call(message, "rngState")) {
                if (!$Array.isArray(message.rngState))
                    return "rngState: array expected";
                for (let i = 0; i < message.rngState.length; ++i)
                    if (!$util.isInteger(message.rngState[i]))
                        return "rngState: integer[] expected";
            }
            if (message.counters != null && $Object.hasOwnProperty.call(message, "counters")) {
                let error = $root.tendril.GrowthCounters.verify(message.counters, _depth + 1);
                if (error)
                    return "counters." + error;
            }
            if (message.series != null && $Object.hasOwnProperty.call(message, "series")) {
                let error = $root.tendril.GrowthSeries.verify(message.series, _depth + 1);
                if (error)
                    return "series." + error;
            }
            if (message.growSeconds != null && $Object.hasOwnProperty.call(message, "growSeconds"))
                if (typeof message.growSeconds !== "number")
                    return "growSeconds: number expected";
            if (message.startedAtMs != null && $Object.hasOwnProperty.call(message, "startedAtMs"))
                if (typeof message.startedAtMs !== "number")
                    return "startedAtMs: number expected";
            if (message.resumes != null && $Object.hasOwnProperty.call(message, "resumes"))
                if (!$util.isInteger(message.resumes))
                    return "resumes: integer expected";
            if (message.dimension != null && $Object.hasOwnProperty.call(message, "dimension"))
                if (!$util.isInteger(message.dimension))
                    return "dimension: integer expected";
            if (message.positions != null && $Object.hasOwnProperty.call(message, "positions"))
                if (!(message.positions && typeof message.positions.length === "number" || $util.isString(message.positions)))
                    return "positions: buffer expected";
            if (message.counterValues != null && $Object.hasOwnProperty.call(message, "counterValues")) {
                if (!$util.isObject(message.counterValues))
                    return "counterValues: object expected";
                let key = $Object.keys(message.counterValues);
                for (let i = 0; i < key.length; ++i)
                    if (typeof message.counterValues[key[i]] !== "number")
                        return "counterValues: number{k:string} expected";
            }
            if (message.modelState != null && $Object.hasOwnProperty.call(message, "modelState"))
                if (!(message.modelState && typeof message.modelState.length === "number" || $util.isString(message.modelState)))
                    return "modelState: buffer expected";
            return null;
        };

        /**
         * Creates a Checkpoint message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.Checkpoint
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.Checkpoint} Checkpoint
         */
        Checkpoint.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.Checkpoint)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.Checkpoint: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.Checkpoint();
            if (object.contractVersion != null)
                if ($Number(object.contractVersion) !== 0)
                    message.contractVersion = object.contractVersion >>> 0;
            if (object.engineVersion != null)
                if (typeof object.engineVersion !== "string" || object.engineVersion.length)
                    message.engineVersion = $String(object.engineVersion);
            if (object.task != null) {
                if (!$util.isObject(object.task))
                    throw $TypeError(".tendril.Checkpoint.task: object expected");
                message.task = $root.tendril.RunTask.fromObject(object.task, _depth + 1);
            }
            if (object.count != null)
                if ($Number(object.count) !== 0)
                    message.count = object.count >>> 0;
            if (object.x != null)
                if (object.x.length)
                    if (typeof object.x === "string")
                        $util.base64.decode(object.x, message.x = $util.newBuffer($util.base64.length(object.x)), 0);
                    else if (object.x.length >= 0)
                        message.x = object.x;
            if (object.y != null)
                if (object.y.length)
                    if (typeof object.y === "string")
                        $util.base64.decode(object.y, message.y = $util.newBuffer($util.base64.length(object.y)), 0);
                    else if (object.y.length >= 0)
                        message.y = object.y;
            if (object.rngState) {
                if (!$Array.isArray(object.rngState))
                    throw $TypeError(".tendril.Checkpoint.rngState: array expected");
                message.rngState = $Array(object.rngState.length);
                for (let i = 0; i < object.rngState.length; ++i)
                    message.rngState[i] = object.rngState[i] >>> 0;
            }
            if (object.counters != null) {
                if (!$util.isObject(object.counters))
                    throw $TypeError(".tendril.Checkpoint.counters: object expected");
                message.counters = $root.tendril.GrowthCounters.fromObject(object.counters, _depth + 1);
            }
            if (object.series != null) {
                if (!$util.isObject(object.series))
                    throw $TypeError(".tendril.Checkpoint.series: object expected");
                message.series = $root.tendril.GrowthSeries.fromObject(object.series, _depth + 1);
            }
            if (object.growSeconds != null)
                if (!$Object.is($Number(object.growSeconds), 0))
                    message.growSeconds = $Number(object.growSeconds);
            if (object.startedAtMs != null)
                if (!$Object.is($Number(object.startedAtMs), 0))
                    message.startedAtMs = $Number(object.startedAtMs);
            if (object.resumes != null)
                if ($Number(object.resumes) !== 0)
                    message.resumes = object.resumes >>> 0;
            if (object.dimension != null)
                if ($Number(object.dimension) !== 0)
                    message.dimension = object.dimension >>> 0;
            if (object.positions != null)
                if (object.positions.length)
                    if (typeof object.positions === "string")
                        $util.base64.decode(object.positions, message.positions = $util.newBuffer($util.base64.length(object.positions)), 0);
                    else if (object.positions.length >= 0)
                        message.positions = object.positions;
            if (object.counterValues) {
                if (!$util.isObject(object.counterValues))
                    throw $TypeError(".tendril.Checkpoint.counterValues: object expected");
                message.counterValues = {};
                for (let keys = $Object.keys(object.counterValues), i = 0; i < keys.length; ++i) {
                    if (keys[i] === "__proto__")
                        $util.makeProp(message.counterValues, keys[i]);
                    message.counterValues[keys[i]] = $Number(object.counterValues[keys[i]]);
                }
            }
            if (object.modelState != null)
                if (object.modelState.length)
                    if (typeof object.modelState === "string")
                        $util.base64.decode(object.modelState, message.modelState = $util.newBuffer($util.base64.length(object.modelState)), 0);
                    else if (object.modelState.length >= 0)
                        message.modelState = object.modelState;
            return message;
        };

        /**
         * Creates a plain object from a Checkpoint message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.Checkpoint
         * @static
         * @param {tendril.Checkpoint} message Checkpoint
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        Checkpoint.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.arrays || options.defaults)
                object.rngState = [];
            if (options.objects || options.defaults)
                object.counterValues = {};
            if (options.defaults) {
                object.contractVersion = 0;
                object.engineVersion = "";
                object.task = null;
                object.count = 0;
                if (options.bytes === $String)
                    object.x = "";
                else {
                    object.x = [];
                    if (options.bytes !== $Array)
                        object.x = $util.newBuffer(object.x);
                }
                if (options.bytes === $String)
                    object.y = "";
                else {
                    object.y = [];
                    if (options.bytes !== $Array)
                        object.y = $util.newBuffer(object.y);
                }
                object.counters = null;
                object.series = null;
                object.growSeconds = 0;
                object.startedAtMs = 0;
                object.resumes = 0;
                object.dimension = 0;
                if (options.bytes === $String)
                    object.positions = "";
                else {
                    object.positions = [];
                    if (options.bytes !== $Array)
                        object.positions = $util.newBuffer(object.positions);
                }
                if (options.bytes === $String)
                    object.modelState = "";
                else {
                    object.modelState = [];
                    if (options.bytes !== $Array)
                        object.modelState = $util.newBuffer(object.modelState);
                }
            }
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion"))
                object.contractVersion = message.contractVersion;
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion"))
                object.engineVersion = message.engineVersion;
            if (message.task != null && $Object.hasOwnProperty.call(message, "task"))
                object.task = $root.tendril.RunTask.toObject(message.task, options, _depth + 1);
            if (message.count != null && $Object.hasOwnProperty.call(message, "count"))
                object.count = message.count;
            if (message.x != null && $Object.hasOwnProperty.call(message, "x"))
                object.x = options.bytes === $String ? $util.base64.encode(message.x, 0, message.x.length) : options.bytes === $Array ? $Array.prototype.slice.call(message.x) : message.x;
            if (message.y != null && $Object.hasOwnProperty.call(message, "y"))
                object.y = options.bytes === $String ? $util.base64.encode(message.y, 0, message.y.length) : options.bytes === $Array ? $Array.prototype.slice.call(message.y) : message.y;
            if (message.rngState && message.rngState.length) {
                object.rngState = $Array(message.rngState.length);
                for (let j = 0; j < message.rngState.length; ++j)
                    object.rngState[j] = message.rngState[j];
            }
            if (message.counters != null && $Object.hasOwnProperty.call(message, "counters"))
                object.counters = $root.tendril.GrowthCounters.toObject(message.counters, options, _depth + 1);
            if (message.series != null && $Object.hasOwnProperty.call(message, "series"))
                object.series = $root.tendril.GrowthSeries.toObject(message.series, options, _depth + 1);
            if (message.growSeconds != null && $Object.hasOwnProperty.call(message, "growSeconds"))
                object.growSeconds = options.json && !$isFinite(message.growSeconds) ? $String(message.growSeconds) : message.growSeconds;
            if (message.startedAtMs != null && $Object.hasOwnProperty.call(message, "startedAtMs"))
                object.startedAtMs = options.json && !$isFinite(message.startedAtMs) ? $String(message.startedAtMs) : message.startedAtMs;
            if (message.resumes != null && $Object.hasOwnProperty.call(message, "resumes"))
                object.resumes = message.resumes;
            if (message.dimension != null && $Object.hasOwnProperty.call(message, "dimension"))
                object.dimension = message.dimension;
            if (message.positions != null && $Object.hasOwnProperty.call(message, "positions"))
                object.positions = options.bytes === $String ? $util.base64.encode(message.positions, 0, message.positions.length) : options.bytes === $Array ? $Array.prototype.slice.call(message.positions) : message.positions;
            let keys2;
            if (message.counterValues && (keys2 = $Object.keys(message.counterValues)).length) {
                object.counterValues = {};
                for (let j = 0; j < keys2.length; ++j) {
                    if (keys2[j] === "__proto__")
                        $util.makeProp(object.counterValues, keys2[j]);
                    object.counterValues[keys2[j]] = options.json && !$isFinite(message.counterValues[keys2[j]]) ? $String(message.counterValues[keys2[j]]) : message.counterValues[keys2[j]];
                }
            }
            if (message.modelState != null && $Object.hasOwnProperty.call(message, "modelState"))
                object.modelState = options.bytes === $String ? $util.base64.encode(message.modelState, 0, message.modelState.length) : options.bytes === $Array ? $Array.prototype.slice.call(message.modelState) : message.modelState;
            return object;
        };

        /**
         * Converts this Checkpoint to JSON.
         * @function toJSON
         * @memberof tendril.Checkpoint
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        Checkpoint.prototype.toJSON = function() {
            return Checkpoint.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for Checkpoint
         * @function getTypeUrl
         * @memberof tendril.Checkpoint
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        Checkpoint.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.Checkpoint";
        };

        return Checkpoint;
    })();

    tendril.PowerLawFit = (function() {

        /**
         * Properties of a PowerLawFit.
         * @typedef {Object} tendril.PowerLawFit.$Properties
         * @property {number|null} [exponent] PowerLawFit exponent
         * @property {number|null} [prefactor] PowerLawFit prefactor
         * @property {number|null} [rSquared] PowerLawFit rSquared
         * @property {number|null} [points] PowerLawFit points
         * @property {number|null} [minX] PowerLawFit minX
         * @property {number|null} [maxX] PowerLawFit maxX
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of a PowerLawFit.
         * @memberof tendril
         * @interface IPowerLawFit
         * @augments tendril.PowerLawFit.$Properties
         * @deprecated Use tendril.PowerLawFit.$Properties instead.
         */

        /**
         * Shape of a PowerLawFit.
         * @typedef {tendril.PowerLawFit.$Properties} tendril.PowerLawFit.$Shape
         */

        /**
         * Constructs a new PowerLawFit.
         * @memberof tendril
         * @classdesc Represents a PowerLawFit.
         * @constructor
         * @param {tendril.PowerLawFit.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const PowerLawFit = function (properties) {
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * PowerLawFit exponent.
         * @member {number} exponent
         * @memberof tendril.PowerLawFit
         * @instance
         */
        PowerLawFit.prototype.exponent = 0;

        /**
         * PowerLawFit prefactor.
         * @member {number} prefactor
         * @memberof tendril.PowerLawFit
         * @instance
         */
        PowerLawFit.prototype.prefactor = 0;

        /**
         * PowerLawFit rSquared.
         * @member {number} rSquared
         * @memberof tendril.PowerLawFit
         * @instance
         */
        PowerLawFit.prototype.rSquared = 0;

        /**
         * PowerLawFit points.
         * @member {number} points
         * @memberof tendril.PowerLawFit
         * @instance
         */
        PowerLawFit.prototype.points = 0;

        /**
         * PowerLawFit minX.
         * @member {number} minX
         * @memberof tendril.PowerLawFit
         * @instance
         */
        PowerLawFit.prototype.minX = 0;

        /**
         * PowerLawFit maxX.
         * @member {number} maxX
         * @memberof tendril.PowerLawFit
         * @instance
         */
        PowerLawFit.prototype.maxX = 0;

        /**
         * Creates a new PowerLawFit instance using the specified properties.
         * @function create
         * @memberof tendril.PowerLawFit
         * @static
         * @param {tendril.PowerLawFit.$Properties=} [properties] Properties to set
         * @returns {tendril.PowerLawFit} PowerLawFit instance
         * @type {{
         *   (properties: tendril.PowerLawFit.$Shape): tendril.PowerLawFit & tendril.PowerLawFit.$Shape;
         *   (properties?: tendril.PowerLawFit.$Properties): tendril.PowerLawFit;
         * }}
         */
        PowerLawFit.create = function(properties) {
            return new PowerLawFit(properties);
        };

        /**
         * Encodes the specified PowerLawFit message. Does not implicitly {@link tendril.PowerLawFit.verify|verify} messages.
         * @function encode
         * @memberof tendril.PowerLawFit
         * @static
         * @param {tendril.PowerLawFit.$Properties} message PowerLawFit message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        PowerLawFit.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.exponent != null && $Object.hasOwnProperty.call(message, "exponent") && !$Object.is(message.exponent, 0))
                writer.uint32(/* id 1, wireType 1 =*/9).double(message.exponent);
            if (message.prefactor != null && $Object.hasOwnProperty.call(message, "prefactor") && !$Object.is(message.prefactor, 0))
                writer.uint32(/* id 2, wireType 1 =*/17).double(message.prefactor);
            if (message.rSquared != null && $Object.hasOwnProperty.call(message, "rSquared") && !$Object.is(message.rSquared, 0))
                writer.uint32(/* id 3, wireType 1 =*/25).double(message.rSquared);
            if (message.points != null && $Object.hasOwnProperty.call(message, "points") && message.points !== 0)
                writer.uint32(/* id 4, wireType 0 =*/32).uint32(message.points);
            if (message.minX != null && $Object.hasOwnProperty.call(message, "minX") && !$Object.is(message.minX, 0))
                writer.uint32(/* id 5, wireType 1 =*/41).double(message.minX);
            if (message.maxX != null && $Object.hasOwnProperty.call(message, "maxX") && !$Object.is(message.maxX, 0))
                writer.uint32(/* id 6, wireType 1 =*/49).double(message.maxX);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified PowerLawFit message, length delimited. Does not implicitly {@link tendril.PowerLawFit.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.PowerLawFit
         * @static
         * @param {tendril.PowerLawFit.$Properties} message PowerLawFit message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        PowerLawFit.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes a PowerLawFit message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.PowerLawFit
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.PowerLawFit & tendril.PowerLawFit.$Shape} PowerLawFit
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        PowerLawFit.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.PowerLawFit();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.exponent = value;
                        else
                            delete message.exponent;
                        continue;
                    }
                case 2: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.prefactor = value;
                        else
                            delete message.prefactor;
                        continue;
                    }
                case 3: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.rSquared = value;
                        else
                            delete message.rSquared;
                        continue;
                    }
                case 4: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.points = value;
                        else
                            delete message.points;
                        continue;
                    }
                case 5: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.minX = value;
                        else
                            delete message.minX;
                        continue;
                    }
                case 6: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.maxX = value;
                        else
                            delete message.maxX;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes a PowerLawFit message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.PowerLawFit
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.PowerLawFit & tendril.PowerLawFit.$Shape} PowerLawFit
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        PowerLawFit.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies a PowerLawFit message.
         * @function verify
         * @memberof tendril.PowerLawFit
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        PowerLawFit.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.exponent != null && $Object.hasOwnProperty.call(message, "exponent"))
                if (typeof message.exponent !== "number")
                    return "exponent: number expected";
            if (message.prefactor != null && $Object.hasOwnProperty.call(message, "prefactor"))
                if (typeof message.prefactor !== "number")
                    return "prefactor: number expected";
            if (message.rSquared != null && $Object.hasOwnProperty.call(message, "rSquared"))
                if (typeof message.rSquared !== "number")
                    return "rSquared: number expected";
            if (message.points != null && $Object.hasOwnProperty.call(message, "points"))
                if (!$util.isInteger(message.points))
                    return "points: integer expected";
            if (message.minX != null && $Object.hasOwnProperty.call(message, "minX"))
                if (typeof message.minX !== "number")
                    return "minX: number expected";
            if (message.maxX != null && $Object.hasOwnProperty.call(message, "maxX"))
                if (typeof message.maxX !== "number")
                    return "maxX: number expected";
            return null;
        };

        /**
         * Creates a PowerLawFit message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.PowerLawFit
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.PowerLawFit} PowerLawFit
         */
        PowerLawFit.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.PowerLawFit)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.PowerLawFit: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.PowerLawFit();
            if (object.exponent != null)
                if (!$Object.is($Number(object.exponent), 0))
                    message.exponent = $Number(object.exponent);
            if (object.prefactor != null)
                if (!$Object.is($Number(object.prefactor), 0))
                    message.prefactor = $Number(object.prefactor);
            if (object.rSquared != null)
                if (!$Object.is($Number(object.rSquared), 0))
                    message.rSquared = $Number(object.rSquared);
            if (object.points != null)
                if ($Number(object.points) !== 0)
                    message.points = object.points >>> 0;
            if (object.minX != null)
                if (!$Object.is($Number(object.minX), 0))
                    message.minX = $Number(object.minX);
            if (object.maxX != null)
                if (!$Object.is($Number(object.maxX), 0))
                    message.maxX = $Number(object.maxX);
            return message;
        };

        /**
         * Creates a plain object from a PowerLawFit message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.PowerLawFit
         * @static
         * @param {tendril.PowerLawFit} message PowerLawFit
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        PowerLawFit.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.defaults) {
                object.exponent = 0;
                object.prefactor = 0;
                object.rSquared = 0;
                object.points = 0;
                object.minX = 0;
                object.maxX = 0;
            }
            if (message.exponent != null && $Object.hasOwnProperty.call(message, "exponent"))
                object.exponent = options.json && !$isFinite(message.exponent) ? $String(message.exponent) : message.exponent;
            if (message.prefactor != null && $Object.hasOwnProperty.call(message, "prefactor"))
                object.prefactor = options.json && !$isFinite(message.prefactor) ? $String(message.prefactor) : message.prefactor;
            if (message.rSquared != null && $Object.hasOwnProperty.call(message, "rSquared"))
                object.rSquared = options.json && !$isFinite(message.rSquared) ? $String(message.rSquared) : message.rSquared;
            if (message.points != null && $Object.hasOwnProperty.call(message, "points"))
                object.points = message.points;
            if (message.minX != null && $Object.hasOwnProperty.call(message, "minX"))
                object.minX = options.json && !$isFinite(message.minX) ? $String(message.minX) : message.minX;
            if (message.maxX != null && $Object.hasOwnProperty.call(message, "maxX"))
                object.maxX = options.json && !$isFinite(message.maxX) ? $String(message.maxX) : message.maxX;
            return object;
        };

        /**
         * Converts this PowerLawFit to JSON.
         * @function toJSON
         * @memberof tendril.PowerLawFit
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        PowerLawFit.prototype.toJSON = function() {
            return PowerLawFit.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for PowerLawFit
         * @function getTypeUrl
         * @memberof tendril.PowerLawFit
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        PowerLawFit.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.PowerLawFit";
        };

        return PowerLawFit;
    })();

    tendril.EnsembleSummary = (function() {

        /**
         * Properties of an EnsembleSummary.
         * @typedef {Object} tendril.EnsembleSummary.$Properties
         * @property {number|null} [contractVersion] EnsembleSummary contractVersion
         * @property {string|null} [ensembleId] EnsembleSummary ensembleId
         * @property {string|null} [name] EnsembleSummary name
         * @property {string|null} [engineVersion] EnsembleSummary engineVersion
         * @property {string|null} [specJson] EnsembleSummary specJson
         * @property {number|null} [clustersPlanned] EnsembleSummary clustersPlanned
         * @property {number|null} [clustersDone] EnsembleSummary clustersDone
         * @property {Array.<tendril.RunResult.$Properties>|null} [runs] EnsembleSummary runs
         * @property {tendril.PowerLawFit.$Properties|null} [radiusOfGyrationFit] EnsembleSummary radiusOfGyrationFit
         * @property {number|null} [fractalDimension] EnsembleSummary fractalDimension
         * @property {number|null} [createdAtMs] EnsembleSummary createdAtMs
         * @property {Array.<number>|null} [meanSizes] EnsembleSummary meanSizes
         * @property {Array.<number>|null} [meanLogRadiusOfGyration] EnsembleSummary meanLogRadiusOfGyration
         * @property {string|null} [statisticsJson] EnsembleSummary statisticsJson
         * @property {boolean|null} [partial] EnsembleSummary partial
         * @property {string|null} [adaptiveJson] EnsembleSummary adaptiveJson
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */

        /**
         * Properties of an EnsembleSummary.
         * @memberof tendril
         * @interface IEnsembleSummary
         * @augments tendril.EnsembleSummary.$Properties
         * @deprecated Use tendril.EnsembleSummary.$Properties instead.
         */

        /**
         * Shape of an EnsembleSummary.
         * @typedef {{
         *   contractVersion?: number|null;
         *   ensembleId?: string|null;
         *   name?: string|null;
         *   engineVersion?: string|null;
         *   specJson?: string|null;
         *   clustersPlanned?: number|null;
         *   clustersDone?: number|null;
         *   runs?: Array.<tendril.RunResult.$Shape>|null;
         *   radiusOfGyrationFit?: tendril.PowerLawFit.$Shape|null;
         *   fractalDimension?: number|null;
         *   createdAtMs?: number|null;
         *   meanSizes?: Array.<number>|null;
         *   meanLogRadiusOfGyration?: Array.<number>|null;
         *   statisticsJson?: string|null;
         *   partial?: boolean|null;
         *   adaptiveJson?: string|null;
         *   $unknowns?: Array.<Uint8Array>;
         * }} tendril.EnsembleSummary.$Shape
         */

        /**
         * Constructs a new EnsembleSummary.
         * @memberof tendril
         * @classdesc Represents an EnsembleSummary.
         * @constructor
         * @param {tendril.EnsembleSummary.$Properties=} [properties] Properties to set
         * @property {Array.<Uint8Array>} [$unknowns] Unknown fields preserved while decoding when enabled
         */
        const EnsembleSummary = function (properties) {
            this.runs = [];
            this.meanSizes = [];
            this.meanLogRadiusOfGyration = [];
            if (properties)
                for (let keys = $Object.keys(properties), i = 0; i < keys.length; ++i)
                    if (properties[keys[i]] != null && keys[i] !== "__proto__")
                        this[keys[i]] = properties[keys[i]];
        };

        /**
         * EnsembleSummary contractVersion.
         * @member {number} contractVersion
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.contractVersion = 0;

        /**
         * EnsembleSummary ensembleId.
         * @member {string} ensembleId
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.ensembleId = "";

        /**
         * EnsembleSummary name.
         * @member {string} name
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.name = "";

        /**
         * EnsembleSummary engineVersion.
         * @member {string} engineVersion
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.engineVersion = "";

        /**
         * EnsembleSummary specJson.
         * @member {string} specJson
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.specJson = "";

        /**
         * EnsembleSummary clustersPlanned.
         * @member {number} clustersPlanned
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.clustersPlanned = 0;

        /**
         * EnsembleSummary clustersDone.
         * @member {number} clustersDone
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.clustersDone = 0;

        /**
         * EnsembleSummary runs.
         * @member {Array.<tendril.RunResult.$Properties>} runs
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.runs = $util.emptyArray;

        /**
         * EnsembleSummary radiusOfGyrationFit.
         * @member {tendril.PowerLawFit.$Properties|null|undefined} radiusOfGyrationFit
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.radiusOfGyrationFit = null;

        /**
         * EnsembleSummary fractalDimension.
         * @member {number} fractalDimension
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.fractalDimension = 0;

        /**
         * EnsembleSummary createdAtMs.
         * @member {number} createdAtMs
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.createdAtMs = 0;

        /**
         * EnsembleSummary meanSizes.
         * @member {Array.<number>} meanSizes
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.meanSizes = $util.emptyArray;

        /**
         * EnsembleSummary meanLogRadiusOfGyration.
         * @member {Array.<number>} meanLogRadiusOfGyration
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.meanLogRadiusOfGyration = $util.emptyArray;

        /**
         * EnsembleSummary statisticsJson.
         * @member {string} statisticsJson
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.statisticsJson = "";

        /**
         * EnsembleSummary partial.
         * @member {boolean} partial
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.partial = false;

        /**
         * EnsembleSummary adaptiveJson.
         * @member {string} adaptiveJson
         * @memberof tendril.EnsembleSummary
         * @instance
         */
        EnsembleSummary.prototype.adaptiveJson = "";

        /**
         * Creates a new EnsembleSummary instance using the specified properties.
         * @function create
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {tendril.EnsembleSummary.$Properties=} [properties] Properties to set
         * @returns {tendril.EnsembleSummary} EnsembleSummary instance
         * @type {{
         *   (properties: tendril.EnsembleSummary.$Shape): tendril.EnsembleSummary & tendril.EnsembleSummary.$Shape;
         *   (properties?: tendril.EnsembleSummary.$Properties): tendril.EnsembleSummary;
         * }}
         */
        EnsembleSummary.create = function(properties) {
            return new EnsembleSummary(properties);
        };

        /**
         * Encodes the specified EnsembleSummary message. Does not implicitly {@link tendril.EnsembleSummary.verify|verify} messages.
         * @function encode
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {tendril.EnsembleSummary.$Properties} message EnsembleSummary message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        EnsembleSummary.encode = function (message, writer, _depth) {
            if (!writer)
                writer = $Writer.create();
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion") && message.contractVersion !== 0)
                writer.uint32(/* id 1, wireType 0 =*/8).uint32(message.contractVersion);
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId") && message.ensembleId !== "")
                writer.uint32(/* id 2, wireType 2 =*/18).string(message.ensembleId);
            if (message.name != null && $Object.hasOwnProperty.call(message, "name") && message.name !== "")
                writer.uint32(/* id 3, wireType 2 =*/26).string(message.name);
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion") && message.engineVersion !== "")
                writer.uint32(/* id 4, wireType 2 =*/34).string(message.engineVersion);
            if (message.specJson != null && $Object.hasOwnProperty.call(message, "specJson") && message.specJson !== "")
                writer.uint32(/* id 5, wireType 2 =*/42).string(message.specJson);
            if (message.clustersPlanned != null && $Object.hasOwnProperty.call(message, "clustersPlanned") && message.clustersPlanned !== 0)
                writer.uint32(/* id 6, wireType 0 =*/48).uint32(message.clustersPlanned);
            if (message.clustersDone != null && $Object.hasOwnProperty.call(message, "clustersDone") && message.clustersDone !== 0)
                writer.uint32(/* id 7, wireType 0 =*/56).uint32(message.clustersDone);
            if (message.runs != null && message.runs.length)
                for (let i = 0; i < message.runs.length; ++i)
                    $root.tendril.RunResult.encode(message.runs[i], writer.uint32(/* id 8, wireType 2 =*/66).fork(), _depth + 1).ldelim();
            if (message.radiusOfGyrationFit != null && $Object.hasOwnProperty.call(message, "radiusOfGyrationFit"))
                $root.tendril.PowerLawFit.encode(message.radiusOfGyrationFit, writer.uint32(/* id 9, wireType 2 =*/74).fork(), _depth + 1).ldelim();
            if (message.fractalDimension != null && $Object.hasOwnProperty.call(message, "fractalDimension") && !$Object.is(message.fractalDimension, 0))
                writer.uint32(/* id 10, wireType 1 =*/81).double(message.fractalDimension);
            if (message.createdAtMs != null && $Object.hasOwnProperty.call(message, "createdAtMs") && !$Object.is(message.createdAtMs, 0))
                writer.uint32(/* id 11, wireType 1 =*/89).double(message.createdAtMs);
            if (message.meanSizes != null && message.meanSizes.length)
                writer.uint32(/* id 12, wireType 2 =*/98).doubles(message.meanSizes);
            if (message.meanLogRadiusOfGyration != null && message.meanLogRadiusOfGyration.length)
                writer.uint32(/* id 13, wireType 2 =*/106).doubles(message.meanLogRadiusOfGyration);
            if (message.statisticsJson != null && $Object.hasOwnProperty.call(message, "statisticsJson") && message.statisticsJson !== "")
                writer.uint32(/* id 14, wireType 2 =*/114).string(message.statisticsJson);
            if (message.partial != null && $Object.hasOwnProperty.call(message, "partial") && message.partial !== false)
                writer.uint32(/* id 15, wireType 0 =*/120).bool(message.partial);
            if (message.adaptiveJson != null && $Object.hasOwnProperty.call(message, "adaptiveJson") && message.adaptiveJson !== "")
                writer.uint32(/* id 16, wireType 2 =*/130).string(message.adaptiveJson);
            if (message.$unknowns != null && $Object.hasOwnProperty.call(message, "$unknowns"))
                for (let i = 0; i < message.$unknowns.length; ++i)
                    writer.raw(message.$unknowns[i]);
            return writer;
        };

        /**
         * Encodes the specified EnsembleSummary message, length delimited. Does not implicitly {@link tendril.EnsembleSummary.verify|verify} messages.
         * @function encodeDelimited
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {tendril.EnsembleSummary.$Properties} message EnsembleSummary message or plain object to encode
         * @param {$protobuf.Writer} [writer] Writer to encode to
         * @returns {$protobuf.Writer} Writer
         */
        EnsembleSummary.encodeDelimited = function(message, writer) {
            return this.encode(message, (writer || $Writer.create()).fork()).ldelim();
        };

        /**
         * Decodes an EnsembleSummary message from the specified reader or buffer.
         * @function decode
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @param {number} [length] Message length if known beforehand
         * @returns {tendril.EnsembleSummary & tendril.EnsembleSummary.$Shape} EnsembleSummary
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        EnsembleSummary.decode = function (reader, length, _end, _depth, _target) {
            if (!(reader instanceof $Reader))
                reader = $Reader.create(reader);
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $Reader.recursionLimit)
                throw $Error("max depth exceeded");
            let end, message, value;
            if (length === $undefined)
                end = reader.len;
            else {
                end = reader.pos + length;
                if (end > reader.len)
                    throw $RangeError("index out of range");
                length = reader.len;
                reader.len = end;
            }
            message = _target || new $root.tendril.EnsembleSummary();
            while (reader.pos < end) {
                let start = reader.pos;
                let tag = reader.tag();
                if (tag === _end) {
                    _end = $undefined;
                    break;
                }
                let wireType = tag & 7;
                switch (tag >>>= 3) {
                case 1: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.contractVersion = value;
                        else
                            delete message.contractVersion;
                        continue;
                    }
                case 2: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.ensembleId = value;
                        else
                            delete message.ensembleId;
                        continue;
                    }
                case 3: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.name = value;
                        else
                            delete message.name;
                        continue;
                    }
                case 4: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.engineVersion = value;
                        else
                            delete message.engineVersion;
                        continue;
                    }
                case 5: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.specJson = value;
                        else
                            delete message.specJson;
                        continue;
                    }
                case 6: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.clustersPlanned = value;
                        else
                            delete message.clustersPlanned;
                        continue;
                    }
                case 7: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.uint32())
                            message.clustersDone = value;
                        else
                            delete message.clustersDone;
                        continue;
                    }
                case 8: {
                        if (wireType !== 2)
                            break;
                        if (!(message.runs && message.runs.length))
                            message.runs = [];
                        message.runs.push($root.tendril.RunResult.decode(reader, reader.size(), $undefined, _depth + 1));
                        continue;
                    }
                case 9: {
                        if (wireType !== 2)
                            break;
                        message.radiusOfGyrationFit = $root.tendril.PowerLawFit.decode(reader, reader.size(), $undefined, _depth + 1, message.radiusOfGyrationFit);
                        continue;
                    }
                case 10: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.fractalDimension = value;
                        else
                            delete message.fractalDimension;
                        continue;
                    }
                case 11: {
                        if (wireType !== 1)
                            break;
                        if (!$Object.is(value = reader.double(), 0))
                            message.createdAtMs = value;
                        else
                            delete message.createdAtMs;
                        continue;
                    }
                case 12: {
                        if (wireType === 2) {
                            if (!(message.meanSizes && message.meanSizes.length))
                                message.meanSizes = [];
                            reader.doubles(message.meanSizes);
                            continue;
                        }
                        if (wireType !== 1)
                            break;
                        if (!(message.meanSizes && message.meanSizes.length))
                            message.meanSizes = [];
                        message.meanSizes.push(reader.double());
                        continue;
                    }
                case 13: {
                        if (wireType === 2) {
                            if (!(message.meanLogRadiusOfGyration && message.meanLogRadiusOfGyration.length))
                                message.meanLogRadiusOfGyration = [];
                            reader.doubles(message.meanLogRadiusOfGyration);
                            continue;
                        }
                        if (wireType !== 1)
                            break;
                        if (!(message.meanLogRadiusOfGyration && message.meanLogRadiusOfGyration.length))
                            message.meanLogRadiusOfGyration = [];
                        message.meanLogRadiusOfGyration.push(reader.double());
                        continue;
                    }
                case 14: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.statisticsJson = value;
                        else
                            delete message.statisticsJson;
                        continue;
                    }
                case 15: {
                        if (wireType !== 0)
                            break;
                        if (value = reader.bool())
                            message.partial = value;
                        else
                            delete message.partial;
                        continue;
                    }
                case 16: {
                        if (wireType !== 2)
                            break;
                        if ((value = reader.stringVerify()).length)
                            message.adaptiveJson = value;
                        else
                            delete message.adaptiveJson;
                        continue;
                    }
                }
                reader.skipType(wireType, _depth, tag);
                if (!reader.discardUnknown) {
                    $util.makeProp(message, "$unknowns", false);
                    (message.$unknowns || (message.$unknowns = [])).push(reader.raw(start, reader.pos));
                }
            }
            if (length !== $undefined) {
                if (reader.pos !== end)
                    throw $RangeError("index out of range");
                reader.len = length;
            }
            if (_end !== $undefined)
                throw $Error("missing end group");
            return message;
        };

        /**
         * Decodes an EnsembleSummary message from the specified reader or buffer, length delimited.
         * @function decodeDelimited
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {$protobuf.Reader|Uint8Array} reader Reader or buffer to decode from
         * @returns {tendril.EnsembleSummary & tendril.EnsembleSummary.$Shape} EnsembleSummary
         * @throws {Error} If the payload is not a reader or valid buffer
         * @throws {$protobuf.util.ProtocolError} If required fields are missing
         */
        EnsembleSummary.decodeDelimited = function(reader) {
            if (!(reader instanceof $Reader))
                reader = new $Reader(reader);
            return this.decode(reader, reader.size());
        };

        /**
         * Verifies an EnsembleSummary message.
         * @function verify
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {Object.<string,*>} message Plain object to verify
         * @returns {string|null} `null` if valid, otherwise the reason why it is not
         */
        EnsembleSummary.verify = function (message, _depth) {
            if (typeof message !== "object" || message === null)
                return "object expected";
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                return "max depth exceeded";
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion"))
                if (!$util.isInteger(message.contractVersion))
                    return "contractVersion: integer expected";
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId"))
                if (!$util.isString(message.ensembleId))
                    return "ensembleId: string expected";
            if (message.name != null && $Object.hasOwnProperty.call(message, "name"))
                if (!$util.isString(message.name))
                    return "name: string expected";
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion"))
                if (!$util.isString(message.engineVersion))
                    return "engineVersion: string expected";
            if (message.specJson != null && $Object.hasOwnProperty.call(message, "specJson"))
                if (!$util.isString(message.specJson))
                    return "specJson: string expected";
            if (message.clustersPlanned != null && $Object.hasOwnProperty.call(message, "clustersPlanned"))
                if (!$util.isInteger(message.clustersPlanned))
                    return "clustersPlanned: integer expected";
            if (message.clustersDone != null && $Object.hasOwnProperty.call(message, "clustersDone"))
                if (!$util.isInteger(message.clustersDone))
                    return "clustersDone: integer expected";
            if (message.runs != null && $Object.hasOwnProperty.call(message, "runs")) {
                if (!$Array.isArray(message.runs))
                    return "runs: array expected";
                for (let i = 0; i < message.runs.length; ++i) {
                    let error = $root.tendril.RunResult.verify(message.runs[i], _depth + 1);
                    if (error)
                        return "runs." + error;
                }
            }
            if (message.radiusOfGyrationFit != null && $Object.hasOwnProperty.call(message, "radiusOfGyrationFit")) {
                let error = $root.tendril.PowerLawFit.verify(message.radiusOfGyrationFit, _depth + 1);
                if (error)
                    return "radiusOfGyrationFit." + error;
            }
            if (message.fractalDimension != null && $Object.hasOwnProperty.call(message, "fractalDimension"))
                if (typeof message.fractalDimension !== "number")
                    return "fractalDimension: number expected";
            if (message.createdAtMs != null && $Object.hasOwnProperty.call(message, "createdAtMs"))
                if (typeof message.createdAtMs !== "number")
                    return "createdAtMs: number expected";
            if (message.meanSizes != null && $Object.hasOwnProperty.call(message, "meanSizes")) {
                if (!$Array.isArray(message.meanSizes))
                    return "meanSizes: array expected";
                for (let i = 0; i < message.meanSizes.length; ++i)
                    if (typeof message.meanSizes[i] !== "number")
                        return "meanSizes: number[] expected";
            }
            if (message.meanLogRadiusOfGyration != null && $Object.hasOwnProperty.call(message, "meanLogRadiusOfGyration")) {
                if (!$Array.isArray(message.meanLogRadiusOfGyration))
                    return "meanLogRadiusOfGyration: array expected";
                for (let i = 0; i < message.meanLogRadiusOfGyration.length; ++i)
                    if (typeof message.meanLogRadiusOfGyration[i] !== "number")
                        return "meanLogRadiusOfGyration: number[] expected";
            }
            if (message.statisticsJson != null && $Object.hasOwnProperty.call(message, "statisticsJson"))
                if (!$util.isString(message.statisticsJson))
                    return "statisticsJson: string expected";
            if (message.partial != null && $Object.hasOwnProperty.call(message, "partial"))
                if (typeof message.partial !== "boolean")
                    return "partial: boolean expected";
            if (message.adaptiveJson != null && $Object.hasOwnProperty.call(message, "adaptiveJson"))
                if (!$util.isString(message.adaptiveJson))
                    return "adaptiveJson: string expected";
            return null;
        };

        /**
         * Creates an EnsembleSummary message from a plain object. Also converts values to their respective internal types.
         * @function fromObject
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {Object.<string,*>} object Plain object
         * @returns {tendril.EnsembleSummary} EnsembleSummary
         */
        EnsembleSummary.fromObject = function (object, _depth) {
            if (object instanceof $root.tendril.EnsembleSummary)
                return object;
            if (!$util.isObject(object))
                throw $TypeError(".tendril.EnsembleSummary: object expected");
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let message = new $root.tendril.EnsembleSummary();
            if (object.contractVersion != null)
                if ($Number(object.contractVersion) !== 0)
                    message.contractVersion = object.contractVersion >>> 0;
            if (object.ensembleId != null)
                if (typeof object.ensembleId !== "string" || object.ensembleId.length)
                    message.ensembleId = $String(object.ensembleId);
            if (object.name != null)
                if (typeof object.name !== "string" || object.name.length)
                    message.name = $String(object.name);
            if (object.engineVersion != null)
                if (typeof object.engineVersion !== "string" || object.engineVersion.length)
                    message.engineVersion = $String(object.engineVersion);
            if (object.specJson != null)
                if (typeof object.specJson !== "string" || object.specJson.length)
                    message.specJson = $String(object.specJson);
            if (object.clustersPlanned != null)
                if ($Number(object.clustersPlanned) !== 0)
                    message.clustersPlanned = object.clustersPlanned >>> 0;
            if (object.clustersDone != null)
                if ($Number(object.clustersDone) !== 0)
                    message.clustersDone = object.clustersDone >>> 0;
            if (object.runs) {
                if (!$Array.isArray(object.runs))
                    throw $TypeError(".tendril.EnsembleSummary.runs: array expected");
                message.runs = $Array(object.runs.length);
                for (let i = 0; i < object.runs.length; ++i) {
                    if (!$util.isObject(object.runs[i]))
                        throw $TypeError(".tendril.EnsembleSummary.runs: object expected");
                    message.runs[i] = $root.tendril.RunResult.fromObject(object.runs[i], _depth + 1);
                }
            }
            if (object.radiusOfGyrationFit != null) {
                if (!$util.isObject(object.radiusOfGyrationFit))
                    throw $TypeError(".tendril.EnsembleSummary.radiusOfGyrationFit: object expected");
                message.radiusOfGyrationFit = $root.tendril.PowerLawFit.fromObject(object.radiusOfGyrationFit, _depth + 1);
            }
            if (object.fractalDimension != null)
                if (!$Object.is($Number(object.fractalDimension), 0))
                    message.fractalDimension = $Number(object.fractalDimension);
            if (object.createdAtMs != null)
                if (!$Object.is($Number(object.createdAtMs), 0))
                    message.createdAtMs = $Number(object.createdAtMs);
            if (object.meanSizes) {
                if (!$Array.isArray(object.meanSizes))
                    throw $TypeError(".tendril.EnsembleSummary.meanSizes: array expected");
                message.meanSizes = $Array(object.meanSizes.length);
                for (let i = 0; i < object.meanSizes.length; ++i)
                    message.meanSizes[i] = $Number(object.meanSizes[i]);
            }
            if (object.meanLogRadiusOfGyration) {
                if (!$Array.isArray(object.meanLogRadiusOfGyration))
                    throw $TypeError(".tendril.EnsembleSummary.meanLogRadiusOfGyration: array expected");
                message.meanLogRadiusOfGyration = $Array(object.meanLogRadiusOfGyration.length);
                for (let i = 0; i < object.meanLogRadiusOfGyration.length; ++i)
                    message.meanLogRadiusOfGyration[i] = $Number(object.meanLogRadiusOfGyration[i]);
            }
            if (object.statisticsJson != null)
                if (typeof object.statisticsJson !== "string" || object.statisticsJson.length)
                    message.statisticsJson = $String(object.statisticsJson);
            if (object.partial != null)
                if (object.partial)
                    message.partial = $Boolean(object.partial);
            if (object.adaptiveJson != null)
                if (typeof object.adaptiveJson !== "string" || object.adaptiveJson.length)
                    message.adaptiveJson = $String(object.adaptiveJson);
            return message;
        };

        /**
         * Creates a plain object from an EnsembleSummary message. Also converts values to other types if specified.
         * @function toObject
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {tendril.EnsembleSummary} message EnsembleSummary
         * @param {$protobuf.IConversionOptions} [options] Conversion options
         * @returns {Object.<string,*>} Plain object
         */
        EnsembleSummary.toObject = function (message, options, _depth) {
            if (!options)
                options = {};
            if (_depth === $undefined)
                _depth = 0;
            if (_depth > $util.recursionLimit)
                throw $Error("max depth exceeded");
            let object = {};
            if (options.arrays || options.defaults) {
                object.runs = [];
                object.meanSizes = [];
                object.meanLogRadiusOfGyration = [];
            }
            if (options.defaults) {
                object.contractVersion = 0;
                object.ensembleId = "";
                object.name = "";
                object.engineVersion = "";
                object.specJson = "";
                object.clustersPlanned = 0;
                object.clustersDone = 0;
                object.radiusOfGyrationFit = null;
                object.fractalDimension = 0;
                object.createdAtMs = 0;
                object.statisticsJson = "";
                object.partial = false;
                object.adaptiveJson = "";
            }
            if (message.contractVersion != null && $Object.hasOwnProperty.call(message, "contractVersion"))
                object.contractVersion = message.contractVersion;
            if (message.ensembleId != null && $Object.hasOwnProperty.call(message, "ensembleId"))
                object.ensembleId = message.ensembleId;
            if (message.name != null && $Object.hasOwnProperty.call(message, "name"))
                object.name = message.name;
            if (message.engineVersion != null && $Object.hasOwnProperty.call(message, "engineVersion"))
                object.engineVersion = message.engineVersion;
            if (message.specJson != null && $Object.hasOwnProperty.call(message, "specJson"))
                object.specJson = message.specJson;
            if (message.clustersPlanned != null && $Object.hasOwnProperty.call(message, "clustersPlanned"))
                object.clustersPlanned = message.clustersPlanned;
            if (message.clustersDone != null && $Object.hasOwnProperty.call(message, "clustersDone"))
                object.clustersDone = message.clustersDone;
            if (message.runs && message.runs.length) {
                object.runs = $Array(message.runs.length);
                for (let j = 0; j < message.runs.length; ++j)
                    object.runs[j] = $root.tendril.RunResult.toObject(message.runs[j], options, _depth + 1);
            }
            if (message.radiusOfGyrationFit != null && $Object.hasOwnProperty.call(message, "radiusOfGyrationFit"))
                object.radiusOfGyrationFit = $root.tendril.PowerLawFit.toObject(message.radiusOfGyrationFit, options, _depth + 1);
            if (message.fractalDimension != null && $Object.hasOwnProperty.call(message, "fractalDimension"))
                object.fractalDimension = options.json && !$isFinite(message.fractalDimension) ? $String(message.fractalDimension) : message.fractalDimension;
            if (message.createdAtMs != null && $Object.hasOwnProperty.call(message, "createdAtMs"))
                object.createdAtMs = options.json && !$isFinite(message.createdAtMs) ? $String(message.createdAtMs) : message.createdAtMs;
            if (message.meanSizes && message.meanSizes.length) {
                object.meanSizes = $Array(message.meanSizes.length);
                for (let j = 0; j < message.meanSizes.length; ++j)
                    object.meanSizes[j] = options.json && !$isFinite(message.meanSizes[j]) ? $String(message.meanSizes[j]) : message.meanSizes[j];
            }
            if (message.meanLogRadiusOfGyration && message.meanLogRadiusOfGyration.length) {
                object.meanLogRadiusOfGyration = $Array(message.meanLogRadiusOfGyration.length);
                for (let j = 0; j < message.meanLogRadiusOfGyration.length; ++j)
                    object.meanLogRadiusOfGyration[j] = options.json && !$isFinite(message.meanLogRadiusOfGyration[j]) ? $String(message.meanLogRadiusOfGyration[j]) : message.meanLogRadiusOfGyration[j];
            }
            if (message.statisticsJson != null && $Object.hasOwnProperty.call(message, "statisticsJson"))
                object.statisticsJson = message.statisticsJson;
            if (message.partial != null && $Object.hasOwnProperty.call(message, "partial"))
                object.partial = message.partial;
            if (message.adaptiveJson != null && $Object.hasOwnProperty.call(message, "adaptiveJson"))
                object.adaptiveJson = message.adaptiveJson;
            return object;
        };

        /**
         * Converts this EnsembleSummary to JSON.
         * @function toJSON
         * @memberof tendril.EnsembleSummary
         * @instance
         * @returns {Object.<string,*>} JSON object
         */
        EnsembleSummary.prototype.toJSON = function() {
            return EnsembleSummary.toObject(this, $protobuf.util.toJSONOptions);
        };

        /**
         * Gets the type url for EnsembleSummary
         * @function getTypeUrl
         * @memberof tendril.EnsembleSummary
         * @static
         * @param {string} [prefix] Custom type url prefix, defaults to `"type.googleapis.com"`
         * @returns {string} The type url
         */
        EnsembleSummary.getTypeUrl = function(prefix) {
            if (prefix === $undefined)
                prefix = "type.googleapis.com";
            return prefix + "/tendril.EnsembleSummary";
        };

        return EnsembleSummary;
    })();

    return tendril;
})();

export {
  $root as default
};
