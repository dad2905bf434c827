import type { UploadProgress } from '../api/send-multipart.js';

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

/** A progress bar for an upload; once every byte is sent the server is still reading the file. */
export function UploadProgressBar({ progress, label }: { progress: UploadProgress | null; label: string }) {
  if (!progress) return null;
  const total = progress.totalBytes || 1;
  const pct = Math.min(100, Math.round((progress.loadedBytes / total) * 100));
  const sent = pct >= 100;
  return (
    <div className="flex flex-col gap-1">
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        aria-valuetext={sent ? 'Sent; the server is checking the file' : `${pct}% sent`}
        className="h-2 w-full overflow-hidden rounded-full bg-ink-100"
      >
        <div className="h-full rounded-full bg-mulberry-700 transition-[width]" style={{ width: `${pct}%` }} />
      </div>
      <p className="text-xs text-ink-600" aria-live="polite">
        {sent ? 'Sent — checking the file…' : `${pct}% · ${mb(progress.loadedBytes)} of ${mb(progress.totalBytes)}`}
      </p>
    </div>
  );
}
