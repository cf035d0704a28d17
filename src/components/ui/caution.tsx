/** Shown on every screen: the computation supports, never replaces, a qualified person's judgement. */
export function Caution({ compact = false }: { compact?: boolean }) {
  return (
    <p role="note" className={`text-ink-soft ${compact ? 'text-xs' : 'text-sm'}`}>
      <strong className="font-bold text-ink">Caution:</strong> Whorl's checks support the judgement of a certified ET Level 3;
      they do not replace it. The applicable standard, customer specification and local regulations always take precedence.
    </p>
  );
}
