/**
 * Writing a sweep's summary into a folder (shared by `tendril run` and
 * `tendril summary` of a farm sweep): sweep.json (schema tendril.sweep/1),
 * sweep.csv (one row per value) and, when asked, report.html with the
 * D(parameter) plot (coordinator/report/sweep-report.ts).
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { writeSweepReport } from '../report/sweep-report.js';
import { sweepToCsv, sweepToJson, type SweepSummary } from '../summary/sweep-summary.js';

/** Writes the files and returns their names relative to `dir`. */
export async function writeSweepFiles(dir: string, s: SweepSummary, o: { report?: boolean } = {}): Promise<string[]> {
  await mkdir(dir, { recursive: true });
  await writeFile(join(dir, 'sweep.json'), sweepToJson(s));
  await writeFile(join(dir, 'sweep.csv'), sweepToCsv(s));
  const written = ['sweep.json', 'sweep.csv'];
  if (o.report ?? true) written.push(...(await writeSweepReport(dir, s)));
  return written;
}
