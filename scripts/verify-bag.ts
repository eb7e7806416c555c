// CLI: npm run verify-bag -- PACKAGE.zip|DIR — checks a BagIt 1.0 bag (RFC 8493). Exit 0 valid, 1 invalid, 2 usage.
import { existsSync } from 'node:fs';
import { verifyBag } from '../lib/bagit/verify-bag';

const USAGE = 'usage: npm run verify-bag -- PACKAGE.zip|BAG_DIRECTORY';

async function main(argv: string[]): Promise<number> {
  if (argv.length !== 1 || argv[0] === '--help' || argv[0] === '-h' || argv[0]!.startsWith('--')) {
    console.error(USAGE);
    return 2;
  }
  const target = argv[0]!;
  if (!existsSync(target)) {
    console.error(`${target}: no such file or directory\n${USAGE}`);
    return 2;
  }
  const report = await verifyBag(target);
  for (const w of report.warnings) console.log(`warning: ${w}`);
  if (!report.valid) {
    for (const p of report.problems) console.log(p);
    console.error(`${target}: INVALID bag, ${report.problems.length} ${report.problems.length === 1 ? 'problem' : 'problems'}`);
    return 1;
  }
  const n = report.payloadFiles;
  console.log(`${target}: valid BagIt bag, ${n} payload ${n === 1 ? 'file' : 'files'}, ${report.payloadBytes} bytes, checked with ${report.algorithms.join(' and ')}`);
  return 0;
}

main(process.argv.slice(2)).then(
  (code) => (process.exitCode = code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : String(error));
    process.exitCode = 2;
  },
);
