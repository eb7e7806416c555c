import type { UploadPhase } from '@/lib/client/uploads/upload-state';

export type UploadProgressProps = { fileName: string; phase: UploadPhase; percent: number | null; text: string };

const BAR: Partial<Record<UploadPhase, string>> = {
  paused: 'bg-slate-400',
  unfinished: 'bg-slate-400',
  ready: 'bg-emerald-600',
  'analysis-failed': 'bg-amber-500',
  failed: 'bg-red-600',
};

/** One file's bar: a real progressbar (value and words for assistive tech) with the phase written beside it. */
export function UploadProgress({ fileName, phase, percent, text }: UploadProgressProps) {
  const indeterminate = percent === null;
  return (
    <div className="flex flex-col gap-1">
      <div
        role="progressbar"
        aria-label={`Progress of ${fileName}`}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={indeterminate ? undefined : percent}
        aria-valuetext={text}
        className="h-2 w-full overflow-hidden rounded-full bg-slate-200"
      >
        <div
          className={`h-full rounded-full transition-[width] duration-300 ${BAR[phase] ?? 'bg-copper-600'} ${indeterminate ? 'w-full animate-pulse' : ''}`}
          style={indeterminate ? undefined : { width: `${percent}%` }}
        />
      </div>
      <p className={`num text-sm ${phase === 'failed' ? 'text-red-800' : phase === 'analysis-failed' ? 'text-amber-900' : 'text-slate-700'}`}>{text}</p>
    </div>
  );
}
