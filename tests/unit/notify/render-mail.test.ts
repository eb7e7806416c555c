// Notification bodies: every value escaped in the HTML part (OWASP XSS prevention rules 1–2), text part verbatim.
import { describe, expect, it } from 'vitest';
import { escapeHtml, html, safeHref } from '@/lib/notify/html';
import { mailJobs } from '@/lib/notify/mail-jobs';
import { returnedMail } from '@/lib/notify/publishing-mails';
import { renderMail } from '@/lib/notify/render-mail';

describe('html template', () => {
  it('escapes interpolated text, keeps nested templates, drops empty values', () => {
    const name = `"><script>alert('x')</script>&`;
    expect(escapeHtml(name)).toBe('&quot;&gt;&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt;&amp;');
    expect(html`<p title="${name}">${[html`<b>${'a<b'}</b>`, null, false]}</p>`.value).toBe(
      '<p title="&quot;&gt;&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt;&amp;"><b>a&lt;b</b></p>',
    );
  });

  it('only lets http(s) URLs become links', () => {
    expect(safeHref('javascript:alert(1)')).toBeNull();
    expect(safeHref('data:text/html,<b>')).toBeNull();
    expect(safeHref('https://doi.org/10.80123/ohm.abcd-efgh')).toBe('https://doi.org/10.80123/ohm.abcd-efgh');
  });
});

describe('renderMail', () => {
  const content = returnedMail({
    title: 'ρ(T) <i>Cu</i>', versionNumber: 3, groupName: 'Larkspur Cryogenic Lab', curatorName: 'Tamsin "T" Quillfeather',
    comment: 'Line one\n<b>Line two</b>', workspaceUrl: 'javascript:alert(1)',
  });
  const mail = renderMail({ ...content, subject: `${content.subject}\r\nBcc: someone@example.test` });

  it('keeps the subject on one line', () => {
    expect(mail.subject).toBe('Returned to draft: ρ(T) <i>Cu</i> (v3) Bcc: someone@example.test');
  });

  it('writes the plain-text part verbatim with the comment quoted', () => {
    expect(mail.text).toBe(
      'Tamsin "T" Quillfeather returned "ρ(T) <i>Cu</i>" (version 3) to draft with this comment:\n\n' +
        '> Line one\n> <b>Line two</b>\n\n' +
        'You can edit the draft again and submit it when it is ready.\n\n' +
        'Open the draft: javascript:alert(1)\n\n' +
        '-- \nYou receive this message because of your role in a dataset on Ohmstead.\n',
    );
  });

  it('escapes everything in the HTML part and never links a non-http URL', () => {
    expect(mail.html).toContain('Tamsin &quot;T&quot; Quillfeather returned &quot;ρ(T) &lt;i&gt;Cu&lt;/i&gt;&quot; (version 3)');
    expect(mail.html).toContain('Line one<br>&lt;b&gt;Line two&lt;/b&gt;</blockquote>');
    expect(mail.html).not.toContain('href="javascript');
    expect(mail.html).toContain('<p style="margin:0 0 14px">Open the draft: javascript:alert(1)</p>');
    expect(mail.html).not.toMatch(/<(i|b|script)>/);
  });
});

describe('mailJobs', () => {
  it('makes one job per distinct address, case-insensitively', () => {
    const jobs = mailJobs(
      [{ email: 'Ada@Larkspur.example', name: 'A' }, { email: 'ada@larkspur.example', name: 'A' }, { email: 'noor@cobaltridge.example', name: 'N' }],
      { subject: 'S', blocks: [{ kind: 'p', text: 'x' }] },
      { aggregateId: 'v1', kind: 'test' },
    );
    expect(jobs.map((j) => [j.topic, j.payload.to, j.payload.subject, j.payload.kind])).toEqual([
      ['mail.send', 'Ada@Larkspur.example', 'S', 'test'],
      ['mail.send', 'noor@cobaltridge.example', 'S', 'test'],
    ]);
  });
});
