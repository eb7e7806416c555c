import type { ReactNode } from 'react';
import { auditActionLabel } from '@/lib/audit/action-labels';
import type { AuditQuery } from '@/lib/audit/list-audit';

export type AuditFiltersProps = {
  /** Where the GET form goes (this page). */
  path: string;
  query: AuditQuery;
  actions: string[];
  /** For the site-wide log: the groups to choose from. */
  groups?: { slug: string; name: string }[];
  fieldErrors?: Record<string, string>;
};

const input = 'rounded-md border border-slate-400 bg-white px-3 py-2 text-sm text-slate-900 shadow-sm';

function Field({ id, label, error, children }: { id: string; label: string; error?: string; children: ReactNode }) {
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium uppercase tracking-wide text-slate-600">{label}</label>
      {children}
      {error && <p id={`${id}-error`} className="text-sm text-red-700">{error}</p>}
    </div>
  );
}

/** A plain GET form, so every filtered view has its own address to bookmark or send on. */
export function AuditFilters({ path, query, actions, groups, fieldErrors = {} }: AuditFiltersProps) {
  const err = (k: string) => (fieldErrors[k] ? { 'aria-invalid': true, 'aria-describedby': `audit-${k}-error` } : {});
  return (
    <form method="get" action={path} className="grid gap-3 rounded-lg border border-slate-200 bg-white p-4 sm:grid-cols-2 lg:grid-cols-4" aria-label="Filter the audit log">
      {groups && (
        <Field id="audit-group" label="Group" error={fieldErrors.group}>
          <select id="audit-group" name="group" defaultValue={query.group ?? ''} className={input} {...err('group')}>
            <option value="">All groups and site events</option>
            {groups.map((g) => <option key={g.slug} value={g.slug}>{g.name}</option>)}
          </select>
        </Field>
      )}
      <Field id="audit-action" label="Action" error={fieldErrors.action}>
        <select id="audit-action" name="action" defaultValue={query.action ?? ''} className={input} {...err('action')}>
          <option value="">Any action</option>
          {actions.map((a) => <option key={a} value={a}>{auditActionLabel(a)} ({a})</option>)}
        </select>
      </Field>
      <Field id="audit-actor" label="Actor" error={fieldErrors.actor}>
        <input id="audit-actor" name="actor" defaultValue={query.actor ?? ''} placeholder="name, e-mail or user id" className={input} {...err('actor')} />
      </Field>
      <Field id="audit-target-type" label="Target type" error={fieldErrors.targetType}>
        <input id="audit-target-type" name="targetType" defaultValue={query.targetType ?? ''} placeholder="e.g. user, dataset_version" className={input} {...err('targetType')} />
      </Field>
      <Field id="audit-target-id" label="Target id" error={fieldErrors.targetId}>
        <input id="audit-target-id" name="targetId" defaultValue={query.targetId ?? ''} className={`${input} font-mono`} {...err('targetId')} />
      </Field>
      <Field id="audit-from" label="From (UTC day)" error={fieldErrors.from}>
        <input id="audit-from" name="from" type="date" defaultValue={query.from ?? ''} className={input} {...err('from')} />
      </Field>
      <Field id="audit-to" label="To (UTC day, included)" error={fieldErrors.to}>
        <input id="audit-to" name="to" type="date" defaultValue={query.to ?? ''} className={input} {...err('to')} />
      </Field>
      <Field id="audit-page-size" label="Per page">
        <select id="audit-page-size" name="pageSize" defaultValue={query.pageSize ?? '50'} className={input}>
          {['25', '50', '100', '200'].map((n) => <option key={n} value={n}>{n}</option>)}
        </select>
      </Field>
      <div className="flex items-end gap-2 sm:col-span-2 lg:col-span-4">
        <button type="submit" className="rounded-md bg-copper-600 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-700">Apply filters</button>
        <a href={path} className="rounded-md px-4 py-2 text-sm font-semibold text-copper-700 hover:bg-copper-50">Clear</a>
      </div>
    </form>
  );
}
