// COUNTER double-click filter, with the check values of ../shared/design/domain.md
// (COUNTER Code of Practice for Research Data: 10:01:00 and 10:01:29 → 1; 10:01:35 → 2).
import { describe, expect, it } from 'vitest';
import { countedClicks, DOUBLE_CLICK_WINDOW_MS, isDoubleClick } from '@/lib/counter/double-click';

const at = (hms: string) => new Date(`2031-03-01T${hms}Z`);
const click = (hms: string, session = 's1', item = 'version-1') => ({ session, item, at: at(hms) });
const count = (flags: boolean[]) => flags.filter(Boolean).length;

describe('countedClicks (domain.md check values)', () => {
  it('10:01:00 and 10:01:29 → 1', () => {
    expect(countedClicks([click('10:01:00'), click('10:01:29')])).toEqual([true, false]);
    expect(count(countedClicks([click('10:01:00'), click('10:01:29')]))).toBe(1);
  });

  it('10:01:00, 10:01:29 and 10:01:35 → 2 (the window runs from the last counted use)', () => {
    expect(countedClicks([click('10:01:00'), click('10:01:29'), click('10:01:35')])).toEqual([true, false, true]);
  });

  it('10:01:00 and 10:01:35 → 2', () => {
    expect(count(countedClicks([click('10:01:00'), click('10:01:35')]))).toBe(2);
  });
});

describe('window edges and keys', () => {
  it('exactly 30 s later counts again; 29.999 s does not', () => {
    expect(DOUBLE_CLICK_WINDOW_MS).toBe(30_000);
    expect(isDoubleClick(at('10:01:00'), at('10:01:30'))).toBe(false);
    expect(isDoubleClick(at('10:01:00'), new Date(at('10:01:30').getTime() - 1))).toBe(true);
    expect(isDoubleClick(null, at('10:01:00'))).toBe(false);
  });

  it('another session or another item is never a double-click', () => {
    expect(countedClicks([click('10:01:00'), click('10:01:05', 's2'), click('10:01:06', 's1', 'file-7')])).toEqual([true, true, true]);
  });

  it('takes uses in time order whatever order they arrive in', () => {
    expect(countedClicks([click('10:01:35'), click('10:01:29'), click('10:01:00')])).toEqual([true, false, true]);
  });

  it('a burst of clicks every 10 s counts once per 30 s from the last counted', () => {
    const burst = ['10:00:00', '10:00:10', '10:00:20', '10:00:30', '10:00:40', '10:00:50', '10:01:00'].map((t) => click(t));
    expect(countedClicks(burst)).toEqual([true, false, false, true, false, false, true]);
  });
});
