// Local DOI registration fake (JSON:API over HTTP, loopback only); state persists under <data>/doi.
import http from 'node:http';
import { createDoiHandler } from './doi-server';
import { DoiStore } from './doi-store';
import { announceReady, onStop, setting } from './lifecycle';

const port = Number(setting('DOI_PORT'));
const store = new DoiStore(setting('DOI_DIR'));
const server = http.createServer(
  createDoiHandler({ store, repositoryId: setting('DOI_REPOSITORY_ID'), password: setting('DOI_PASSWORD'), prefix: setting('DOI_PREFIX') }),
);

server.once('error', (error) => {
  console.error('DOI fake failed:', error.message);
  process.exit(1);
});
onStop(
  () =>
    new Promise<void>((resolve) => {
      server.close(() => resolve());
      server.closeAllConnections();
    }),
);
server.listen(port, '127.0.0.1', () => announceReady(`DOI fake listening on http://127.0.0.1:${port} (${store.all().length} DOIs on file)`));
