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
    expect(text).toContain('Four-wire ρ(T) of an annealed copper wire, 2–300 K');
    expect(text).toContain('Larkspur Cryogenic Lab');
    expect(text).toContain('Tidewater Thin Films Group');
    expect(text).toContain('Cobalt Ridge Magnetotransport Lab');
    expect(text).not.toContain('Niobium wire resistive transition'); // a draft
  });

  it('title search finds a published dataset and treats % as a literal character', async () => {
    expect((await html('/search?q=copper')).text).toContain('annealed copper wire');
    const literal = await html('/search?q=%25');
    expect(literal.text).toContain('No published dataset matches');
  });

  it('a group page lists members with roles; an unknown group is a 404', async () => {
    const { text } = await html('/groups/larkspur-cryogenic');
    expect(text).toContain('Maren Quillfeather');
    expect(text).toContain('owner');
    expect((await html('/groups/no-such-lab')).status).toBe(404);
  });
});
