import type { RenderedMail } from '../mail/templates.js';
import { recommendationAsText } from '../../shared/review/recommendation.js';

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const when = (d: Date) => d.toUTCString().replace(/:\d\d GMT$/, ' UTC');

/** Text paragraphs (already plain) → a simple, safe HTML body with one button. */
function html(paragraphs: string[], link: string, button: string): string {
  const body = paragraphs
    .map((p) => `<p style="margin:0 0 12px;white-space:pre-line">${esc(p)}</p>`)
    .join('');
  return (
    `<!doctype html><html><body style="font:15px/1.5 system-ui,sans-serif;color:#1f2933;max-width:34rem;margin:24px auto;padding:0 16px">` +
    `<p style="font-weight:600;font-size:17px;margin:0 0 16px">Warpmeter</p>${body}` +
    `<p style="margin:20px 0"><a href="${esc(link)}" style="background:#1f4e79;color:#fff;padding:10px 18px;border-radius:6px;text-decoration:none">${esc(button)}</a></p>` +
    `<p style="margin:0;font-size:13px;color:#52606d">If the button does not work, paste this address into your browser:<br>${esc(link)}</p>` +
    `</body></html>`
  );
}

function mail(subject: string, paragraphs: string[], link: string, button: string): RenderedMail {
  return { subject, text: `${paragraphs.join('\n\n')}\n\n${link}\n`, html: html(paragraphs, link, button) };
}

interface RequestMailInput {
  studioName: string;
  editorName: string;
  projectTitle: string;
  roundNumber: number;
  shortlistCount: number;
  recommendation: string;
  link: string;
}

/** To a reviewer who already has an account in the studio. */
export function reviewRequestMail(o: RequestMailInput): RenderedMail {
  return mail(
    `Please review the projection shortlist for “${o.projectTitle}”`,
    [
      `${o.editorName} at ${o.studioName} asks you to review ${o.shortlistCount === 1 ? 'one candidate projection' : `${o.shortlistCount} candidate projections`} for “${o.projectTitle}” (round ${o.roundNumber}).`,
      `Their recommendation:\n${recommendationAsText(o.recommendation)}`,
      'Open the review to compare the candidates, then approve one or send the shortlist back with your comments.',
    ],
    o.link,
    'Open the review',
  );
}

/** To a reviewer with no account in the studio yet: the one-time link sets their password first. */
export function reviewerInviteMail(o: RequestMailInput & { expiresAt: Date; hasAccount: boolean }): RenderedMail {
  const setUp = o.hasAccount
    ? `Open the link below and confirm with your existing Warpmeter password to join as a client reviewer. The link works once and until ${when(o.expiresAt)}.`
    : `Open the link below to choose your name and password; you will then see the review. The link works once and until ${when(o.expiresAt)}.`;
  return mail(
    `${o.studioName} asks you to review “${o.projectTitle}” on Warpmeter`,
    [
      `${o.editorName} at ${o.studioName} asks you to review ${o.shortlistCount === 1 ? 'one candidate projection' : `${o.shortlistCount} candidate projections`} for “${o.projectTitle}” as a client reviewer.`,
      setUp,
      `Their recommendation:\n${recommendationAsText(o.recommendation)}`,
      'If you were not expecting this, you can ignore this message; nothing happens until the link is used.',
    ],
    o.link,
    'Set your password and review',
  );
}

/** To the editor and the project's cartographer when the reviewer decides. */
export function decisionMail(o: {
  projectTitle: string;
  roundNumber: number;
  reviewerName: string;
  decision: 'approved' | 'returned';
  candidateLabel?: string;
  comment?: string | null;
  recordHash?: string;
  link: string;
}): RenderedMail {
  const lines =
    o.decision === 'approved'
      ? [
          `${o.reviewerName} approved “${o.candidateLabel}” for “${o.projectTitle}” (round ${o.roundNumber}).`,
          `The sign-off record is stored with the SHA-256 ${o.recordHash}.`,
        ]
      : [
          `${o.reviewerName} returned the shortlist for “${o.projectTitle}” (round ${o.roundNumber}). The project is back in work; send a new shortlist when it is ready.`,
        ];
  if (o.comment) lines.push(`Their comment:\n${o.comment}`);
  const subject =
    o.decision === 'approved' ? `Approved: “${o.projectTitle}”` : `Returned for changes: “${o.projectTitle}”`;
  return mail(subject, lines, o.link, 'Open the project');
}
