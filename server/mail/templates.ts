import type { Role } from '../../shared/api/roles.js';

/** A rendered message: plain text for every mail client, simple HTML for the rest. */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

const ROLE_WORDS: Record<Role, string> = {
  admin: 'an admin (people, seats and billing)',
  cartographer: 'a cartographer (projects, regions and audits)',
  editor: 'an editor (comparing audits and writing the recommendation)',
  client: 'a client reviewer (reviewing the shortlist and signing off)',
};

const when = (d: Date) => d.toUTCString().replace(/:\d\d GMT$/, ' UTC');

function page(paragraphs: string[], link: string, buttonLabel: string, footer: string): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${esc(p)}</p>`).join('');
  return (
    `<!doctype html><html><body style="font:15px/1.5 system-ui,sans-serif;color:#1f2933;max-width:34rem;margin:24px auto;padding:0 16px">` +
    `<p style="font-weight:600;font-size:17px;margin:0 0 16px">Warpmeter</p>${body}` +
    `<p style="margin:20px 0"><a href="${esc(link)}" style="background:#1f4e79;color:#fff;padding:10px 18px;border-radius:6px;text-decoration:none">${esc(buttonLabel)}</a></p>` +
    `<p style="margin:0 0 12px;font-size:13px;color:#52606d">If the button does not work, paste this address into your browser:<br>${esc(link)}</p>` +
    `<p style="margin:16px 0 0;font-size:13px;color:#52606d">${esc(footer)}</p></body></html>`
  );
}

export function inviteMail(opts: { studioName: string; inviterName: string; role: Role; link: string; expiresAt: Date }): RenderedMail {
  const lines = [
    `${opts.inviterName} has asked you to join ${opts.studioName} on Warpmeter as ${ROLE_WORDS[opts.role]}.`,
    `Open the link below to set your name and password. It works once and until ${when(opts.expiresAt)}.`,
  ];
  const footer = 'If you were not expecting this, you can ignore this message; nothing happens until the link is used.';
  return {
    subject: `Join ${opts.studioName} on Warpmeter`,
    text: `${lines.join('\n\n')}\n\n${opts.link}\n\n${footer}\n`,
    html: page(lines, opts.link, 'Accept the invitation', footer),
  };
}

export function resetMail(opts: { name: string; link: string; expiresAt: Date }): RenderedMail {
  const lines = [
    `Hello ${opts.name || 'there'},`,
    `Someone (we hope you) asked to choose a new Warpmeter password for this address.`,
    `Open the link below to choose it. It works once and until ${when(opts.expiresAt)}.`,
  ];
  const footer = 'If you did not ask for this, ignore this message: your password stays as it is.';
  return {
    subject: 'Choose a new Warpmeter password',
    text: `${lines.join('\n\n')}\n\n${opts.link}\n\n${footer}\n`,
    html: page(lines, opts.link, 'Choose a new password', footer),
  };
}
