import type { ReactNode } from 'react';

export type NoticeProps = { tone?: 'info' | 'error' | 'success' | 'caution'; title?: string; children: ReactNode };

const TONES: Record<NonNullable<NoticeProps['tone']>, string> = {
  info: 'border-slate-300 bg-white text-slate-800',
  error: 'border-red-300 bg-red-50 text-red-900',
  success: 'border-emerald-300 bg-emerald-50 text-emerald-900',
  caution: 'border-amber-300 bg-amber-50 text-amber-950',
};

export function Notice({ tone = 'info', title, children }: NoticeProps) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-md border px-4 py-3 text-sm ${TONES[tone]}`}>
      {title && <p className="font-semibold">{title}</p>}
      <div>{children}</div>
    </div>
  );
}
