/**
 * Published reference values and rigorous bounds of a model, shown beside our
 * estimates in the consistency panel and never used as fit input. They are
 * declared by each model's descriptor (worker/models/<kind>/descriptor.ts),
 * with their sources; this file only shapes them for the statistics.
 */
import type { ContextValue, DimensionBound, PublishedValue } from '../../worker/core/model-descriptor.js';
import { isModelKind, modelDescriptor } from '../../worker/models/registry.js';

export type { DimensionBound, PublishedValue };

export interface ModelReference {
  modelKind: string;
  embeddingDimension: number;
  /** Published fractal dimension, if any. */
  dimension: PublishedValue | null;
  /** Rigorous bounds on D besides D <= embedding dimension. */
  bounds: DimensionBound[];
  /** Values shown for context only, never checked. */
  context: ContextValue[];
  /** Below this size the estimators are not expected to agree (and why), or null. */
  finiteSize: { belowSize: number; note: string } | null;
}

/** The reference entry for a model kind, or null for an unknown kind. */
export function referenceFor(modelKind: string | null | undefined): ModelReference | null {
  if (!isModelKind(modelKind)) return null;
  const d = modelDescriptor(modelKind);
  return { modelKind, embeddingDimension: d.dimension, dimension: d.reference.dimension, bounds: [...d.reference.bounds], context: [...d.reference.context], finiteSize: d.reference.finiteSize ?? null };
}
