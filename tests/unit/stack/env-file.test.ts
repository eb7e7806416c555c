import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { shellQuote } from '@/lib/format/shell-quote';
import { envFileText, writeEnvFile } from '@/scripts/stack/env-file';
import { dataLayout } from '@/scripts/stack/layout';
import { parseEnvSh } from '@/scripts/stack-env-file';

const dir = mkdtempSync(path.join(os.tmpdir(), 'ohmstead-env-file-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const env = {
  PORT: '3200',
  DATABASE_URL: 'mysql://root@127.0.0.1:3327/ohmstead',
  MAIL_FROM: 'Ohmstead <no-reply@ohmstead.test>',
  ODD: "it's $HOME `x` \"q\"",
};

describe('the stack env file (npm start and npm run services write <data dir>/env.sh)', () => {
  it("single-quotes values and writes a quote as '\\'' (POSIX shell quoting, common practice)", () => {
    expect(shellQuote("it's")).toBe("'it'\\''s'");
    expect(envFileText({ A: 'x y' })).toBe("A='x y'\n");
  });

  it('reads back through parseEnvSh, which scripts run by hand use', () => {
    expect(parseEnvSh(envFileText(env))).toEqual(env);
  });

  it('gives a POSIX shell the same values when sourced with set -a', () => {
    const file = writeEnvFile({ env, layout: dataLayout(dir) });
    expect(file).toBe(path.join(dir, 'env.sh'));
    expect(statSync(file).mode & 0o777).toBe(0o600);
    const out = execFileSync('sh', ['-c', `set -a; . "${file}"; set +a; printf '%s\\n' "$PORT" "$DATABASE_URL" "$MAIL_FROM" "$ODD"`], {
      // Were $HOME expanded, ODD would read back changed.
      env: { ...process.env, HOME: '/nowhere' },
    }).toString();
    expect(out.split('\n').slice(0, 4)).toEqual([env.PORT, env.DATABASE_URL, env.MAIL_FROM, env.ODD]);
    expect(readFileSync(file, 'utf8').split('\n')).toHaveLength(5);
  });
});
