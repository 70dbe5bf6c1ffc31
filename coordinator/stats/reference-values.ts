/**
 * Published reference values and rigorous bounds per model kind. They are
 * shown beside our estimates in the consistency panel and are never used as
 * fit input. Sources as in /work/shared/REFERENCES.md.
 */

export interface PublishedValue {
  value: number;
  /** One-sigma uncertainty as published. */
  uncertainty: number;
  source: string;
}

export interface DimensionBound {
  /** 'lower' means D >= value, 'upper' means D <= value. */
  side: 'lower' | 'upper';
  value: number;
  rule: string;
  source: string;
}

export interface ModelReference {
  modelKind: string;
  embeddingDimension: number;
  /** Published fractal dimension, if any. */
  dimension: PublishedValue | null;
  /** Rigorous bounds on D besides D <= embedding dimension. */
  bounds: DimensionBound[];
}

export const MODEL_REFERENCES: Readonly<Record<string, ModelReference>> = {
  'dla-offlattice-2d': {
    modelKind: 'dla-offlattice-2d',
    embeddingDimension: 2,
    dimension: {
      value: 1.71,
      uncertainty: 0.0002,
      source: 'Menshutin, Shchur & Vinokur 2008, Physica A 387, 6299 (1000 clusters of 5e7 particles)',
    },
    bounds: [
      {
        side: 'lower',
        value: 1.5,
        rule: "Kesten's bound: radius after n particles at most C n^(2/3), so D >= 3/2",
        source: 'Kesten 1987, Stoch. Proc. Appl. 25, 165',
      },
    ],
  },
};

/** The reference entry for a model kind, or null if we have none. */
export function referenceFor(modelKind: string | null | undefined): ModelReference | null {
  if (!modelKind) return null;
  return Object.prototype.hasOwnProperty.call(MODEL_REFERENCES, modelKind) ? MODEL_REFERENCES[modelKind] : null;
}
