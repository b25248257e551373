export default function Loading() {
  return <p className="text-sm text-slate-400" aria-live="polite">Loading renders…</p>;
}
