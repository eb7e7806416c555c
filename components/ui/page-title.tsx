import type { ReactNode } from 'react';

export function PageTitle({ children, lead }: { children: ReactNode; lead?: ReactNode }) {
  return (
    <div className="mb-6">
      <h1 className="text-2xl font-semibold tracking-tight text-slate-900">{children}</h1>
      {lead && <p className="mt-1 max-w-2xl text-slate-600">{lead}</p>}
    </div>
  );
}
