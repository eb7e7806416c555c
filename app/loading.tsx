export default function Loading() {
  return <p role="status" className="py-16 text-center text-slate-500">Loading…</p>;
}
