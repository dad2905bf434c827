import { Link } from 'react-router';
import type { PeopleList } from '@shared/api/people.schema.js';
import { cn } from '@/lib/cn.js';
import { plural } from '@/lib/format.js';

/** Seat use: active staff plus pending staff invitations, against the seats the studio holds. */
export function SeatUsage({ seats }: { seats: PeopleList['seats'] }) {
  const full = seats.used >= seats.total;
  const share = seats.total > 0 ? Math.min(1, seats.used / seats.total) : 1;
  return (
    <div className="w-72 max-w-full">
      <p className="text-sm font-medium text-ink-950 tabular" data-testid="seat-usage">
        {seats.used} of {plural(seats.total, 'staff seat', 'staff seats')}
      </p>
      <div
        className="mt-1.5 h-2 overflow-hidden rounded-full bg-ink-100"
        role="meter"
        aria-label="Staff seats in use"
        aria-valuemin={0}
        aria-valuemax={seats.total}
        aria-valuenow={seats.used}
      >
        <div className={cn('h-full rounded-full', full ? 'bg-vermilion-700' : 'bg-mulberry-700')} style={{ width: `${share * 100}%` }} />
      </div>
      <p className="mt-1 text-xs text-ink-600">
        {full ? (
          <>
            All seats are taken. <Link to="/studio/billing" className="font-medium text-mulberry-700 underline">Add seats</Link> or
            deactivate someone to invite more staff. Client reviewers are always free.
          </>
        ) : (
          'Client reviewers take no seat.'
        )}
      </p>
    </div>
  );
}
