// Content-Disposition checked against the examples of RFC 6266 §5 and RFC 8187 §3.2.3.
import { describe, expect, it } from 'vitest';
import { asciiFallback, contentDisposition, downloadFileName, encodeExtValue } from '@/lib/downloads/content-disposition';

describe('encodeExtValue (RFC 8187)', () => {
  it('encodes the RFC examples ("€ rates", "£ and € rates"), hex in upper case', () => {
    expect(encodeExtValue('€ rates')).toBe('%E2%82%AC%20rates'); // RFC 6266 §5: %e2%82%ac%20rates
    expect(encodeExtValue('£ and € rates')).toBe('%C2%A3%20and%20%E2%82%AC%20rates'); // RFC 8187 §3.2.3
  });

  it("keeps attr-chars and encodes what encodeURIComponent would leave (' ( ) *)", () => {
    expect(encodeExtValue("a-b_c.d~e!f#g$h&i+j^k`l|m")).toBe("a-b_c.d~e!f#g$h&i+j^k`l|m");
    expect(encodeExtValue("it's (v2)*.csv")).toBe('it%27s%20%28v2%29%2A.csv');
  });
});

describe('contentDisposition', () => {
  it('gives a plain ASCII name both ways', () => {
    expect(contentDisposition('rxx_1p8K.csv')).toBe(`attachment; filename="rxx_1p8K.csv"; filename*=UTF-8''rxx_1p8K.csv`);
  });

  it('keeps the UTF-8 name in filename* and a safe ASCII stand-in in filename', () => {
    expect(contentDisposition('ρ(T) µΩ·cm.dat')).toBe(`attachment; filename="_(T) ___cm.dat"; filename*=UTF-8''%CF%81%28T%29%20%C2%B5%CE%A9%C2%B7cm.dat`);
  });

  it('cannot be broken out of: quotes, backslashes, CR/LF and folders are neutralised', () => {
    const header = contentDisposition('../../etc/pa"ss\\wd\r\nSet-Cookie: x=1.csv');
    expect(header).not.toMatch(/[\r\n]/);
    expect(header).toBe(`attachment; filename="etc_pa_ss_wd__Set-Cookie_ x=1.csv"; filename*=UTF-8''etc_pa_ss_wd__Set-Cookie_%20x%3D1.csv`);
  });

  it('names an empty or dot-only name "file", and replaces % in the fallback (RFC 6266 appendix D)', () => {
    expect(downloadFileName('...')).toBe('file');
    expect(asciiFallback('100%.csv')).toBe('100_.csv');
  });
});
