/**
 * `tendril models [--format text|json]`: every registered model (the
 * descriptors of worker/models/registry.ts) with its one-line definition,
 * dimension and lattice, its parameters (unit, default, allowed range,
 * meaning), counters, observables, probe and picture, and the published
 * reference values shown beside its estimates (value, error, source).
 * `tendril --help` lists the models too (modelsHelpText).
 */
import type { Command } from 'commander';
import type { ModelDescriptor } from '../../worker/core/model-descriptor.js';
import { describeRange } from '../../worker/core/value-range.js';
import { MODELS } from '../../worker/models/registry.js';
import { UsageError } from '../usage-error.js';

export const MODELS_FORMATS = ['text', 'json'] as const;

/** The JSON document of `tendril models --format json` (stable field names, snake_case like specs). */
export function modelsDocument(models: readonly ModelDescriptor[] = MODELS): { models: Array<Record<string, unknown>> } {
  return {
    models: models.map((d) => ({
      kind: d.kind,
      dimension: d.dimension,
      lattice: d.lattice,
      definition: d.definition,
      definition_file: d.definitionFile,
      params: d.params.map((p) => ({
        name: p.name,
        unit: p.unit,
        default: p.default,
        min: p.min,
        min_open: p.minOpen === true,
        max: p.max,
        max_open: p.maxOpen === true,
        integer: p.integer === true,
        allowed: describeRange(p, p.unit),
        meaning: p.meaning,
      })),
      counters: d.counters.map((c) => ({ ...c })),
      observables: d.observables.map((o) => ({ ...o })),
      probe: d.probe,
      picture: d.picture,
      contact_distance: d.contactDistance,
      reference: {
        dimension: d.reference.dimension ? { value: d.reference.dimension.value, error: d.reference.dimension.uncertainty, source: d.reference.dimension.source } : null,
        bounds: d.reference.bounds.map((b) => ({ ...b })),
        context: d.reference.context.map((c) => ({ ...c })),
      },
    })),
  };
}

/** The text of `tendril models`: one block per model. */
export function modelsText(models: readonly ModelDescriptor[] = MODELS): string {
  const out: string[] = [];
  for (const d of models) {
    out.push(`${d.kind}  (${d.dimension}D, ${d.lattice === null ? 'off-lattice' : `${d.lattice} lattice`})`);
    out.push(`  definition: ${d.definition} (exact definition: ${d.definitionFile})`);
    if (d.params.length === 0) out.push('  parameters: none');
    else {
      out.push('  parameters (spec: [params] NAME = VALUE; grow: --param NAME=VALUE):');
      for (const p of d.params) out.push(`    ${p.name} = ${p.default}${p.unit ? ` ${p.unit}` : ''} (default); allowed: ${describeRange(p)}; ${p.meaning}`);
    }
    out.push(`  counters: ${d.counters.map((c) => c.name).join(', ') || 'none'}`);
    out.push(`  observables besides R_g, R_max and the centre offset: ${d.observables.map((o) => o.name).join(', ') || 'none'}`);
    out.push(`  harmonic-measure probe: ${d.probe ?? 'none'}; cluster picture: ${d.picture ?? 'none'}`);
    const r = d.reference;
    out.push(`  reference dimension: ${r.dimension ? `D = ${r.dimension.value} ± ${r.dimension.uncertainty} (${r.dimension.source})` : 'none published'}`);
    for (const b of r.bounds) out.push(`  bound: D ${b.side === 'lower' ? '>=' : '<='} ${b.value}: ${b.rule} (${b.source})`);
    for (const c of r.context) out.push(`  context only: ${c.label} = ${Number(c.value.toFixed(6))} (${c.source})`);
    out.push('');
  }
  return out.join('\n');
}

/** The lines `tendril --help` ends with. */
export function modelsHelpText(models: readonly ModelDescriptor[] = MODELS): string {
  const width = Math.max(...models.map((d) => d.kind.length));
  return ['', 'Models (details: tendril models):', ...models.map((d) => `  ${d.kind.padEnd(width)}  ${d.definition}`), ''].join('\n');
}

export function register(program: Command): void {
  program
    .command('models')
    .description('list every growth model: definition, parameters (unit, default, range, meaning), reference values')
    .option('--format <format>', 'text or json', 'text')
    .action((opts: { format: string }) => {
      if (!(MODELS_FORMATS as readonly string[]).includes(opts.format)) throw new UsageError(`--format: ${JSON.stringify(opts.format)} is not allowed; allowed: one of ${MODELS_FORMATS.join(', ')}`);
      process.stdout.write(opts.format === 'json' ? JSON.stringify(modelsDocument(), null, 2) + '\n' : modelsText());
    });
  program.addHelpText('after', modelsHelpText());
}
