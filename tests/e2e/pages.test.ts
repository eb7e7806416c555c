import { describe, expect, it } from 'vitest';
import { baseUrl } from '@/tests/support/e2e';

async function html(path: string): Promise<{ status: number; text: string }> {
  const response = await fetch(new URL(path, baseUrl));
  return { status: response.status, text: await response.text() };
}

describe('public pages render from the demo data', () => {
  it('home lists published demo datasets and the three labs, never drafts', async () => {
    const { status, text } = await html('/');
    expect(status).toBe(200);
    expect(text).toContain('Resistivity of a 50 nm copper film from 2 K to 300 K (Bloch–Grüneisen)');
    expect(text).toContain('Larkspur Cryogenic Lab');
    expect(text).toContain('Tidewater Thin Films Group');
    expect(text).toContain('Cobalt Ridge Magnetotransport Lab');
    expect(text).not.toContain('Superconducting transition of a niobium wire'); // a draft
    expect(text).not.toContain('magnetoresistance of a WTe2 flake'); // in review
  });

  it('search finds a published dataset by material, never a draft, and reads % as no word rather than a wildcard', async () => {
    const copper = await html('/search?q=copper');
    expect(copper.status).toBe(200);
    expect(copper.text).toContain('Bloch–Grüneisen'); // the title, with "copper" marked as the match
    expect(copper.text).toContain('<mark');
    expect((await html('/search?q=niobium')).text).toContain('Nothing matches'); // the niobium dataset is a draft
    const literal = await html('/search?q=%25');
    expect(literal.status).toBe(200);
    expect(literal.text).toContain('The search text has no words to look for, so every version is listed.');
  });

  it('a group page lists members with roles; an unknown group is a 404', async () => {
    const { text } = await html('/groups/larkspur-cryogenic');
    expect(text).toContain('Maren Quillfeather');
    expect(text).toContain('owner');
    expect((await html('/groups/no-such-lab')).status).toBe(404);
  });
});
