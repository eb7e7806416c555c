import type { FieldError } from '@/lib/schema';
import { fieldId } from './schema-walk';

/** Link target of an error: the field itself, or the form part's heading when a whole part is missing. */
function anchorOf(path: string): string {
  return ['sample', 'measurement', 'environment'].includes(path) ? `part-${path}` : fieldId(path.split('.'));
}

/** What must still be fixed or filled in before the record is complete, each linked to its field. */
export function Completeness({ wrong, missing }: { wrong: FieldError[]; missing: FieldError[] }) {
  if (wrong.length === 0 && missing.length === 0) {
    return <p className="rounded-md border border-emerald-300 bg-emerald-50 px-4 py-3 text-sm text-emerald-900">The record is complete: every required field is filled in and every value is valid.</p>;
  }
  return (
    <div className="flex flex-col gap-3 text-sm">
      {wrong.length > 0 && (
        <div className="rounded-md border border-red-300 bg-red-50 px-4 py-3 text-red-950">
          <p className="font-semibold">{wrong.length === 1 ? '1 value needs fixing' : `${wrong.length} values need fixing`} (saved as typed until then)</p>
          <ul className="mt-1 list-disc pl-5">
            {wrong.map((e) => <li key={`${e.path}-${e.keyword}`}><a className="inline-block min-h-6 py-0.5 underline" href={`#${anchorOf(e.path)}`}>{e.message}</a></li>)}
          </ul>
        </div>
      )}
      {missing.length > 0 && (
        <div className="rounded-md border border-slate-300 bg-white px-4 py-3 text-slate-800">
          <p className="font-semibold">Still to fill in before the record is complete</p>
          <ul className="mt-1 list-disc pl-5">
            {missing.map((e) => <li key={`${e.path}-${e.keyword}`}><a className="inline-block min-h-6 py-0.5 text-copper-700 underline" href={`#${anchorOf(e.path)}`}>{e.message}</a></li>)}
          </ul>
        </div>
      )}
    </div>
  );
}
