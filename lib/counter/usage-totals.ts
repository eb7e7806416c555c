// COUNTER metrics of one item or a group of items. Investigations include requests: every download is also an
// investigation of the dataset (COUNTER R5 "Total_Item_Investigations … includes Total_Item_Requests", from memory).

export type UsageTotals = {
  investigations: { total: number; unique: number };
  requests: { total: number; unique: number };
};

export const NO_USAGE: UsageTotals = { investigations: { total: 0, unique: 0 }, requests: { total: 0, unique: 0 } };

/** MariaDB returns COUNT as a number and SUM as a decimal string; both, or null, become integers. */
const int = (v: unknown) => (v === null || v === undefined ? 0 : Number(v));

export type UsageRow = { inv_total: unknown; inv_unique: unknown; req_total: unknown; req_unique: unknown };

export function totalsFromRow(row: UsageRow | undefined): UsageTotals {
  if (!row) return NO_USAGE;
  return {
    investigations: { total: int(row.inv_total), unique: int(row.inv_unique) },
    requests: { total: int(row.req_total), unique: int(row.req_unique) },
  };
}

/** Sums per-item metrics; unique counts add up because COUNTER counts them per item. */
export function addTotals(a: UsageTotals, b: UsageTotals): UsageTotals {
  return {
    investigations: { total: a.investigations.total + b.investigations.total, unique: a.investigations.unique + b.investigations.unique },
    requests: { total: a.requests.total + b.requests.total, unique: a.requests.unique + b.requests.unique },
  };
}
