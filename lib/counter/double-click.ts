// COUNTER double-click filter: the same user-session opening the same item again within 30 seconds counts once.
// The window runs from the last *counted* use (domain.md check values: 10:01:00 and 10:01:29 → 1; 10:01:35 → 2).

export const DOUBLE_CLICK_WINDOW_MS = 30_000;

/** True when `at` falls within 30 s after the session's last counted use of the item (exactly 30 s counts again). */
export function isDoubleClick(lastCountedAt: Date | null, at: Date): boolean {
  if (!lastCountedAt) return false;
  const gap = at.getTime() - lastCountedAt.getTime();
  return gap >= 0 && gap < DOUBLE_CLICK_WINDOW_MS;
}

export type Click = { session: string; item: string; at: Date };

/** Which of these uses count, in input order (uses are taken in time order; ties keep input order). */
export function countedClicks(clicks: readonly Click[]): boolean[] {
  const order = clicks.map((c, i) => ({ c, i })).sort((a, b) => a.c.at.getTime() - b.c.at.getTime() || a.i - b.i);
  const lastCounted = new Map<string, Date>();
  const counted = new Array<boolean>(clicks.length).fill(false);
  for (const { c, i } of order) {
    const key = `${c.session}\n${c.item}`;
    if (isDoubleClick(lastCounted.get(key) ?? null, c.at)) continue;
    lastCounted.set(key, c.at);
    counted[i] = true;
  }
  return counted;
}
