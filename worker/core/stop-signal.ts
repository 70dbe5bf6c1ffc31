/**
 * Stopping a run from outside while its kernel is in the middle of a walk.
 *
 * A stop signal is one Int32 in a SharedArrayBuffer: the host (main thread)
 * raises it with Atomics, the kernel reads it every STOP_CHECK_EVERY walker
 * steps inside its hot loop. A kernel that sees it raised abandons the
 * particle it is walking, puts its random generator back to where that
 * particle began, and returns from growTo: the state is then exactly the one
 * after the last whole particle, so the checkpoint taken next resumes to the
 * same bits. Reading the flag consumes no random numbers, so trajectories are
 * unchanged whether a signal is given or not.
 *
 * The same counter bounds the work of one particle: a walker that needs more
 * than MAX_STEPS_PER_PARTICLE steps is not making progress (its steps are
 * below the float resolution of its coordinates, or the model is broken), and
 * the kernel throws WalkerStuck, which fails the run for good with that reason.
 */

/** Walker steps between two reads of the stop flag. */
export const STOP_CHECK_EVERY = 4096;

/**
 * Most walker steps one particle may take. A valid walk-on-spheres walker
 * takes of the order of 10^2–10^3 steps per particle (jumps shrink
 * geometrically towards the cluster; a far walker is returned in one step),
 * so 10^8 is far out of reach of any valid run and is hit within seconds by a
 * stuck one.
 */
export const MAX_STEPS_PER_PARTICLE = 100_000_000;

/** Index 0 is non-zero once a stop is requested. */
export type StopSignal = Int32Array;

export function createStopSignal(): StopSignal {
  return new Int32Array(new SharedArrayBuffer(4));
}

export function raiseStop(s: StopSignal): void {
  Atomics.store(s, 0, 1);
}

export function stopRaised(s: StopSignal | undefined): boolean {
  return s !== undefined && Atomics.load(s, 0) !== 0;
}

/** A walker that made no progress: the run fails with this one-line reason (never retried: it would be stuck again). */
export class WalkerStuck extends Error {
  override name = 'WalkerStuck';
}

/**
 * What a walker loop does every STOP_CHECK_EVERY steps, `steps` being the
 * steps of the current particle counted so far: true when the stop signal
 * is raised (the caller puts its generator back and returns); throws
 * WalkerStuck, with the reason (run, particle, the walker's radius, min_step),
 * once the particle has taken `maxSteps`. Plain arguments: nothing is
 * allocated in the walker loop.
 */
export function walkInterrupted(stop: StopSignal | undefined, steps: number, maxSteps: number, runIndex: number, particle: number, radius: number, minStep: number): boolean {
  if (stopRaised(stop)) return true;
  if (steps >= maxSteps) {
    throw new WalkerStuck(
      `run ${runIndex}: the walker of particle ${particle} made no progress in ${steps} steps at radius ${radius.toPrecision(6)} (params.min_step = ${minStep} is too small for the float spacing there)`,
    );
  }
  return false;
}
