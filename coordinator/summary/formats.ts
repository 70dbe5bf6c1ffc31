/**
 * Names of the summary's output formats and CSV tables, in a module of their
 * own so the CLI can list them in its help without loading the statistics.
 * coordinator/summary/index.ts builds one table per name (the compiler checks
 * that every name has one).
 */
const CSV_TABLE_KEYS = ['series', 'runs', 'mass-radius', 'estimators', 'local-slopes', 'batches', 'harmonic'] as const;
export type CsvTableName = (typeof CSV_TABLE_KEYS)[number];
export const CSV_TABLE_NAMES: string[] = [...CSV_TABLE_KEYS];

export type SummaryFormat = 'json' | 'csv' | 'pb';
export const SUMMARY_FORMATS: SummaryFormat[] = ['json', 'csv', 'pb'];
