/** A progress card's headline: the percentage in large figures (the bar beside it carries it for screen readers) and what is happening, announced politely. */
export function ProgressHeadline({ percent, status }: { percent: string; status: string }) {
  return (
    <div className="flex flex-wrap items-baseline justify-between gap-2">
      <p className="text-2xl font-bold tabular-nums" aria-hidden="true">
        {percent}
      </p>
      <p className="text-foam-300" aria-live="polite">
        {status}
      </p>
    </div>
  );
}
