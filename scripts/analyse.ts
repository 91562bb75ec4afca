// The command-line analyser (issue 4, "Command line"):
//   npm run analyse -- <files or zips> [--profile FILE.json]… [--register FILE.csv] [--time-zone ZONE] [--json]
// The same pipeline as the server's import job (lib/pipeline), without the server or the
// database. This file is the edge: it reads the files named and prints; every decision
// is made in lib/pipeline. Exit status: 0 when every input was read, 1 when an input (or
// a zip entry) could not be read at all, 2 for a wrong command line, profile or register.

import { readFileSync, statSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { isKnownTimeZone } from '@/lib/import/time-zone';
import { parseInstrumentProfile, type InstrumentProfile } from '@/lib/import/instrument-profile';
import { createAnalysisRun } from '@/lib/pipeline/analyse-inputs';
import { makeProblem } from '@/lib/pipeline/problems';
import { problemJson, runJsonLines } from '@/lib/pipeline/test-json';
import { formatTextReport } from '@/lib/pipeline/text-report';
import { registerFromCsv, type TrapRegister } from '@/lib/pipeline/trap-register';

const USAGE = `Usage: npm run analyse -- <files or zips…> [--profile FILE.json]… [--register FILE.csv] [--time-zone ZONE] [--json]

  --profile FILE.json   an instrument profile exported from the app; give several for
                        several layouts (each file takes the one whose header it has).
                        Without one, each file's detected layout is used.
  --register FILE.csv   the trap register (the CSV the app imports): trap types, line
                        pressures, sizes and status. Without it every trap is of unknown
                        type and no saturation check or loss estimate is made.
  --time-zone ZONE      IANA zone for local times the profile leaves to the site
                        (default: this computer's zone).
  --json                one JSON object per line (tests and problems) instead of tables.`;

function fail(message: string, code = 2): never {
  process.stderr.write(`analyse: ${message}\n`);
  process.exit(code);
}

function readText(path: string, what: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (e) {
    return fail(`cannot read the ${what} ${path}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message}`);
  }
}

function main(): void {
  let args: ReturnType<typeof parse>;
  const parse = () =>
    parseArgs({
      allowPositionals: true,
      options: {
        profile: { type: 'string', multiple: true },
        register: { type: 'string' },
        'time-zone': { type: 'string' },
        json: { type: 'boolean', default: false },
        help: { type: 'boolean', short: 'h', default: false },
      },
    });
  try {
    args = parse();
  } catch (e) {
    return fail(`${(e as Error).message}\n${USAGE}`);
  }
  const { values, positionals } = args;
  if (values.help) {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  if (positionals.length === 0) fail(`name at least one file or zip\n${USAGE}`);

  const profiles: InstrumentProfile[] = (values.profile ?? []).map((path) => {
    const r = parseInstrumentProfile(readText(path, 'instrument profile'));
    if (!r.ok) fail(`the instrument profile ${path} is not valid:\n  ${r.issues.join('\n  ')}`);
    return r.profile;
  });

  const timeZone = values['time-zone'] ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  if (!isKnownTimeZone(timeZone)) fail(`unknown time zone "${timeZone}"; expected an IANA zone such as Europe/London`);

  let register: TrapRegister | null = null;
  const registerProblems = [];
  if (values.register) {
    const r = registerFromCsv(readText(values.register, 'register'), values.register);
    registerProblems.push(...r.problems);
    if (!r.register) {
      fail(`the register ${values.register} cannot be used:\n  ${r.problems.filter((p) => p.severity === 'error').map((p) => p.message).join('\n  ')}`);
    }
    register = r.register;
  }

  const run = createAnalysisRun({ profiles, timeZone, register });
  for (const path of positionals) {
    let bytes: Uint8Array;
    try {
      if (statSync(path).isDirectory()) throw Object.assign(new Error('is a folder'), { code: 'EISDIR' });
      bytes = new Uint8Array(readFileSync(path));
    } catch (e) {
      const why = (e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message;
      process.stderr.write(`analyse: cannot read ${path}: ${why}\n`);
      run.addUnreadable(path, makeProblem({ file: path }, 'file-missing', 'error', `cannot be opened: ${why}`, { expected: 'a meter export or a zip of them' }));
      continue;
    }
    run.add(path, bytes);
  }
  const result = run.finish();
  const problems = [...registerProblems, ...result.problems];

  if (values.json) {
    const lines = [...registerProblems.map(problemJson), ...runJsonLines(result)].map((o) => JSON.stringify(o));
    process.stdout.write(lines.length ? `${lines.join('\n')}\n` : '');
  } else {
    process.stdout.write(formatTextReport({ ...result, problems }, { registerSource: register?.source ?? null, timeZone }));
  }
  if (result.unreadable.length) {
    process.stderr.write(`analyse: could not read ${result.unreadable.length} input${result.unreadable.length === 1 ? '' : 's'}: ${result.unreadable.join(', ')}\n`);
    process.exitCode = 1;
  }
}

main();
