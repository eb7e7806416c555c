// The SMTP fake started by `npm test`: real SMTP from nodemailer, checked in MAIL_DIR.
import { readFile, readdir } from 'node:fs/promises';
import path from 'node:path';
import nodemailer from 'nodemailer';
import { describe, expect, it } from 'vitest';
import { readMailbox, waitForMail } from '@/tests/support/mailbox';
import { assertLoopback, requireEnv } from '@/tests/support/services';

const smtp = assertLoopback(requireEnv('SMTP_URL'), 'SMTP');
const mailDir = requireEnv('MAIL_DIR');
// As lib/mail/send-mail.ts connects to the local fake: plain SMTP, no STARTTLS (stack.md).
const transport = nodemailer.createTransport({ host: smtp.hostname, port: Number(smtp.port), secure: false, ignoreTLS: true });
const tag = () => Math.random().toString(36).slice(2, 8);

describe('SMTP fake', () => {
  it('keeps a message as .eml and .json with subject, text, html and links', async () => {
    const t = tag();
    const since = new Date();
    const info = await transport.sendMail({
      from: 'Ohmstead <no-reply@ohmstead.test>',
      to: `curator-${t}@brightwater-lab.test`,
      subject: `Confirm your address ${t}`,
      text: `Open http://localhost:3101/verify?token=${t}. It expires in 24 hours.`,
      html: `<p><a href="http://localhost:3101/verify?token=${t}&amp;next=%2Fhome">Confirm</a></p>`,
    });
    expect(info.accepted).toEqual([`curator-${t}@brightwater-lab.test`]);

    const mail = await waitForMail({ to: `curator-${t}@brightwater-lab.test`, subject: `Confirm your address ${t}`, since });
    expect(mail.from).toBe('"Ohmstead" <no-reply@ohmstead.test>');
    expect(mail.headerTo).toEqual([`curator-${t}@brightwater-lab.test`]);
    expect(mail.text.trim()).toBe(`Open http://localhost:3101/verify?token=${t}. It expires in 24 hours.`);
    expect(mail.html).toContain('Confirm</a>');
    // The href (entity-decoded) and the text link without its sentence-ending full stop.
    expect(mail.links).toEqual([`http://localhost:3101/verify?token=${t}&next=%2Fhome`, `http://localhost:3101/verify?token=${t}`]);
    expect(mail.messageId).toBe(info.messageId);

    const raw = await readFile(path.join(mailDir, mail.eml), 'utf8');
    expect(raw).toContain(`Subject: Confirm your address ${t}`);
    expect(mail.size).toBe(Buffer.byteLength(raw));
  });

  it('records envelope recipients, so Bcc is visible to tests', async () => {
    const t = tag();
    await transport.sendMail({
      from: 'no-reply@ohmstead.test',
      to: `pi-${t}@brightwater-lab.test`,
      bcc: `audit-${t}@brightwater-lab.test`,
      subject: `Review requested ${t}`,
      text: 'A dataset awaits review.',
    });
    const mail = await waitForMail({ to: `audit-${t}@brightwater-lab.test`, subject: `Review requested ${t}` });
    expect(mail.to.sort()).toEqual([`audit-${t}@brightwater-lab.test`, `pi-${t}@brightwater-lab.test`]);
    expect(mail.headerTo).toEqual([`pi-${t}@brightwater-lab.test`]);
    expect(mail.links).toEqual([]);
  });

  it('loses nothing under concurrent sends and names files in arrival order', async () => {
    const t = tag();
    const before = (await readMailbox()).length;
    const pool = nodemailer.createTransport({ host: smtp.hostname, port: Number(smtp.port), secure: false, ignoreTLS: true, pool: true, maxConnections: 5 });
    await Promise.all(
      Array.from({ length: 20 }, (_, i) => pool.sendMail({ from: 'no-reply@ohmstead.test', to: `bulk-${t}@brightwater-lab.test`, subject: `bulk ${t} ${i}`, text: String(i) })),
    );
    pool.close();
    const all = await readMailbox();
    expect(all.length - before).toBe(20);
    const mine = all.filter((m) => m.to.includes(`bulk-${t}@brightwater-lab.test`));
    expect(mine.map((m) => Number(m.text.trim())).sort((a, b) => a - b)).toEqual(Array.from({ length: 20 }, (_, i) => i));
    const ids = mine.map((m) => m.id);
    expect([...ids].sort()).toEqual(ids);
    const names = await readdir(mailDir);
    expect(names.filter((n) => n.endsWith('.tmp'))).toEqual([]);
    for (const m of mine) expect(names).toContain(m.eml);
  });

  it('keeps a bare message without From or MIME headers, taking the sender from the envelope', async () => {
    const t = tag();
    await transport.sendMail({
      envelope: { from: 'lab@brightwater-lab.test', to: [`raw-${t}@ohmstead.test`] },
      raw: `Subject: raw ${t}\r\n\r\nplain body https://ohmstead.test/d/${t}\r\n`,
    });
    const mail = await waitForMail({ to: `raw-${t}@ohmstead.test` });
    expect(mail.subject).toBe(`raw ${t}`);
    expect(mail.from).toBe('lab@brightwater-lab.test');
    expect(mail.links).toEqual([`https://ohmstead.test/d/${t}`]);
  });
});
