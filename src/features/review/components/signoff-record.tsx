import type { SignOffView } from '@shared/api/review.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button, buttonClasses } from '@/components/ui/button.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { isApiError } from '@/lib/api-client.js';
import { signOffSheetUrl } from '../api/get-signoff.js';
import { useVerifySignOff } from '../api/verify-signoff.js';
import { formatDateTime } from './format-time.js';

/** The sealed record: who approved what and when, its hash, a re-run check and the PDF sheet. */
export function SignOffRecord({ signOff }: { signOff: SignOffView }) {
  const verify = useVerifySignOff(signOff.projectId, signOff.id);
  const result = verify.data;
  return (
    <Card aria-labelledby="signoff-heading">
      <CardHeader
        id="signoff-heading"
        title="Sign-off record"
        description="Permanent: nobody can change or delete it."
        actions={
          <a className={buttonClasses('secondary', 'sm')} href={signOffSheetUrl(signOff.id)} target="_blank" rel="noreferrer">
            Sign-off sheet (PDF)
          </a>
        }
      />
      <CardBody className="flex flex-col gap-4 text-sm">
        <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[10rem_minmax(0,1fr)]">
          <dt className="text-ink-600">Approved candidate</dt>
          <dd className="font-medium">{signOff.candidate.label}</dd>
          <dt className="text-ink-600">PROJ string</dt>
          <dd className="font-mono text-xs break-all">{signOff.candidate.resolved}</dd>
          <dt className="text-ink-600">Approved by</dt>
          <dd>
            {signOff.reviewerName} ({signOff.reviewerEmail}), signed “{signOff.signature}”
          </dd>
          <dt className="text-ink-600">Approved at</dt>
          <dd>{formatDateTime(signOff.approvedAt)}</dd>
          {signOff.comment && (
            <>
              <dt className="text-ink-600">Comment</dt>
              <dd className="whitespace-pre-line">{signOff.comment}</dd>
            </>
          )}
          <dt className="text-ink-600">Record SHA-256</dt>
          <dd className="font-mono text-xs break-all" data-testid="record-hash">
            {signOff.recordHash}
          </dd>
        </dl>
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" size="sm" loading={verify.isPending} onClick={() => verify.mutate()}>
            Verify: re-run the audit
          </Button>
          <span className="text-xs text-ink-600">Recomputes the scorecard from the stored region, definition, settings and seed, then hashes the record again.</span>
        </div>
        {verify.isError && (
          <Alert tone="error" title="Verification could not run">
            {isApiError(verify.error) ? verify.error.message : 'Please try again.'}
          </Alert>
        )}
        {result && (
          <Alert tone={result.hashMatches ? 'success' : 'warning'} title={result.hashMatches ? 'Reproduced: the numbers and the hash match' : 'Not reproduced'}>
            <ul className="mt-1 space-y-0.5">
              <li>Stored record intact: {result.recordIntact ? 'yes' : 'no'}</li>
              <li>Region geometry matches its hash: {result.regionHashMatches ? 'yes' : 'no'}</li>
              <li>Metrics identical: {result.metricsMatch ? 'yes' : `no, ${result.differences.length} differ`}</li>
              <li className="font-mono text-xs break-all">Recomputed hash: {result.recomputedHash}</li>
              <li>
                Engine: recorded {result.engineVersion.stored}, now {result.engineVersion.current} · took {(result.elapsedMs / 1000).toFixed(1)} s
              </li>
            </ul>
            {result.differences.length > 0 && (
              <ul className="mt-2 list-disc pl-5 text-xs">
                {result.differences.slice(0, 8).map((d) => (
                  <li key={d.metric}>
                    {d.metric}: stored {String(d.stored)}, recomputed {String(d.recomputed)}
                  </li>
                ))}
              </ul>
            )}
          </Alert>
        )}
      </CardBody>
    </Card>
  );
}
