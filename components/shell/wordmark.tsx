// The Shuntwise mark: a four-terminal shunt drawn as a copper bar with two sense taps.
export function Wordmark({ small = false }: { small?: boolean }) {
  const h = small ? 22 : 32;
  return (
    <span className="inline-flex items-center gap-2 text-ink">
      <svg width={h * 1.6} height={h} viewBox="0 0 48 30" aria-hidden="true">
        <line x1="2" y1="18" x2="10" y2="18" stroke="#1d232b" strokeWidth="2.5" strokeLinecap="round" />
        <line x1="38" y1="18" x2="46" y2="18" stroke="#1d232b" strokeWidth="2.5" strokeLinecap="round" />
        <rect x="10" y="13" width="28" height="10" rx="2" fill="#a4532c" />
        <line x1="17" y1="13" x2="17" y2="3" stroke="#1f5f8b" strokeWidth="2.5" strokeLinecap="round" />
        <line x1="31" y1="13" x2="31" y2="3" stroke="#1f5f8b" strokeWidth="2.5" strokeLinecap="round" />
      </svg>
      <span className={`${small ? "text-lg" : "text-2xl"} font-bold tracking-tight`}>
        Shunt<span className="text-copper">wise</span>
      </span>
    </span>
  );
}
