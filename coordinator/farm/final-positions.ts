/**
 * The final state of a run that keeps positions (`ID/run-I.final`, a
 * Checkpoint at count = particles) in the artifact store, written and read
 * streamed: the framed file of proto/checkpoint-file.ts, in chunks of 1 MiB
 * straight from (and into) one positions array, so that keeping a giant
 * cluster's final state never builds a second whole-cluster buffer. The
 * bytes are those of encodeCheckpoint (the same frame), so a reader of the
 * whole file (ArtifactStore.get + decodeCheckpoint) reads it too.
 */
import { readCheckpointFile, writeCheckpointFile } from '../../proto/checkpoint-file.js';
import type { CheckpointData } from '../../proto/convert.js';
import type { ClusterPositions } from '../../worker/core/growth-kernel.js';
import { positionsOf } from '../harmonic/ensemble-probing.js';
import { finalKey } from '../../worker/runtime/job-contract.js';
import type { ArtifactStore } from './artifacts.js';

/** Write the final state of run `runIndex` of `ensembleId` (temporary file, flushed, renamed into place). */
export async function putFinalState(artifacts: ArtifactStore, ensembleId: string, runIndex: number, final: CheckpointData): Promise<void> {
  const file = await artifacts.checkpointFile(finalKey(ensembleId, runIndex));
  writeCheckpointFile(file.path, final);
}

/** The final positions of run `runIndex` of `ensembleId` read from the store, or null when none are kept. */
export async function finalPositionsIn(artifacts: ArtifactStore, ensembleId: string, runIndex: number): Promise<ClusterPositions | null> {
  const file = await artifacts.checkpointFile(finalKey(ensembleId, runIndex));
  if (!file.exists) return null;
  return positionsOf(readCheckpointFile(file.path));
}
