import type { AuditSummary } from '@shared/api/audits.schema.js';
import { Badge, type BadgeTone } from '@/components/ui/badge.js';

const STATUS: Record<AuditSummary['status'], { label: string; tone: BadgeTone }> = {
  queued: { label: 'Waiting', tone: 'neutral' },
  running: { label: 'Running', tone: 'brand' },
  done: { label: 'Done', tone: 'success' },
  failed: { label: 'Failed', tone: 'danger' },
};

/** Status badge and, while the audit runs, a progress bar with its percentage. */
export function AuditProgress({ audit }: { audit: Pick<AuditSummary, 'id' | 'status' | 'progress'> }) {
  const s = STATUS[audit.status];
  const pct = Math.round(audit.progress * 100);
  return (
    <div className="flex items-center gap-3">
      <Badge tone={s.tone}>{s.label}</Badge>
      {(audit.status === 'running' || audit.status === 'queued') && (
        <div
          role="progressbar"
          aria-label={`Audit ${audit.id} progress`}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={pct}
          className="h-2 w-32 overflow-hidden rounded-full bg-ink-100"
        >
          <div className="h-full rounded-full bg-mulberry-600 transition-[width]" style={{ width: `${pct}%` }} />
        </div>
      )}
      {audit.status === 'running' && <span className="tabular text-xs text-ink-600">{pct} %</span>}
    </div>
  );
}
