import { parseRecommendation } from '@shared/review/recommendation.js';
import { cn } from '@/lib/cn.js';

/**
 * A recommendation as paragraphs and bullet lists. Built from text nodes only: whatever the
 * editor typed (tags included) is shown as typed, never interpreted as HTML.
 */
export function RecommendationText({ text, className }: { text: string; className?: string }) {
  const blocks = parseRecommendation(text);
  if (!blocks.length) return <p className={cn('text-sm text-ink-600', className)}>No recommendation written yet.</p>;
  return (
    <div className={cn('space-y-2 text-sm leading-relaxed text-ink-950', className)}>
      {blocks.map((b, i) =>
        b.kind === 'paragraph' ? (
          <p key={i}>{b.text}</p>
        ) : (
          <ul key={i} className="list-disc space-y-1 pl-5">
            {b.items.map((item, j) => (
              <li key={j}>{item}</li>
            ))}
          </ul>
        ),
      )}
    </div>
  );
}
