// Local SMTP fake for development and tests: loopback only, plain SMTP, optional auth; keeps every message in MAIL_DIR.
import { SMTPServer } from 'smtp-server';
import { announceReady, onStop, setting } from './lifecycle';
import { storeMessage } from './mail-store';

const port = Number(setting('SMTP_PORT'));
const mailDir = setting('MAIL_DIR');

const server = new SMTPServer({
  name: 'ohmstead-mail-fake',
  banner: 'Ohmstead local mail fake (keeps messages, delivers nothing)',
  secure: false,
  // No TLS at all: nodemailer connects with secure:false, ignoreTLS:true.
  disabledCommands: ['STARTTLS'],
  authOptional: true,
  allowInsecureAuth: true,
  size: 50 * 1024 * 1024,
  logger: false,
  onAuth(auth, _session, callback) {
    callback(null, { user: auth.username ?? 'anonymous' });
  },
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on('data', (c: Buffer) => chunks.push(c));
    stream.on('error', (error) => callback(error));
    stream.on('end', () => {
      if (stream.sizeExceeded) {
        callback(Object.assign(new Error('Message exceeds the 50 MB limit of the mail fake'), { responseCode: 552 }));
        return;
      }
      const envelope = {
        mailFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
        rcptTo: session.envelope.rcptTo.map((r) => r.address),
      };
      storeMessage(mailDir, Buffer.concat(chunks), envelope).then(
        (m) => {
          console.log(`${m.date} stored ${m.id} to=${m.to.join(',')} subject=${JSON.stringify(m.subject)}`);
          callback(null, `Message kept as ${m.id}`);
        },
        // Tell the client: a message we could not store must not look delivered.
        (error: unknown) => {
          console.error('could not store message:', error);
          callback(Object.assign(new Error('Mail fake could not store the message'), { responseCode: 451 }));
        },
      );
    });
  },
});

let listening = false;
server.on('error', (error) => {
  console.error('smtp error:', error.message);
  if (!listening) process.exit(1);
});
onStop(() => new Promise<void>((resolve) => server.close(() => resolve())));
server.listen(port, '127.0.0.1', () => {
  listening = true;
  announceReady(`SMTP fake listening on 127.0.0.1:${port}, keeping mail in ${mailDir}`);
});
