import { Command, Help } from 'commander';
import { describe, expect, it } from 'vitest';
import { COMMANDS } from '../coordinator/cli.js';

// `tendril --help` lists the commands from the table in coordinator/cli.ts
// without loading their modules (start-up time; measured by
// scripts/measure-startup.mjs, never in a test). The table must say what the
// modules register.

describe('the CLI command table', () => {
  it('matches, for every command, the term and description its module registers', async () => {
    for (const e of COMMANDS) {
      const program = new Command();
      (await e.load()).register(program);
      const name = e.term.split(' ')[0];
      const cmd = program.commands.find((c) => c.name() === name);
      expect(cmd, `module of "${name}" registers it`).toBeDefined();
      expect(new Help().subcommandTerm(cmd!)).toBe(e.term);
      expect(cmd!.description()).toBe(e.description);
    }
  });

  it('lists every command a module registers', async () => {
    const all = new Set<string>();
    for (const e of COMMANDS) {
      const program = new Command();
      (await e.load()).register(program);
      for (const c of program.commands) all.add(c.name());
    }
    expect([...all].sort()).toEqual(COMMANDS.map((e) => e.term.split(' ')[0]).sort());
  });
});
