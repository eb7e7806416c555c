// `npm run reset`: wipe .data/ (database, objects, mail, DOI state, secrets) — refused while `npm start` runs.
import { existsSync, rmSync } from 'node:fs';
import { profileLayout, rel } from './stack/layout';
import { runningFrom } from './stack/pidfiles';

const layout = profileLayout('dev');
const running = runningFrom(layout);
if (running.length) {
  console.error(
    `Refusing to reset: Ohmstead services are running from ${rel(layout.dir)}/ ` +
      `(${running.map((e) => `${e.name} pid ${e.pid}`).join(', ')}). Stop \`npm start\` first (Ctrl-C), then run npm run reset again.`,
  );
  process.exit(1);
}
if (!existsSync(layout.dir)) {
  console.log(`Nothing to reset: ${rel(layout.dir)}/ does not exist.`);
} else {
  rmSync(layout.dir, { recursive: true, force: true });
  console.log(`Removed ${rel(layout.dir)}/ (database, stored files, mail, DOI state, secrets). The next npm start seeds the demo data again.`);
}
