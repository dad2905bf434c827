import { describe, expect, it } from 'vitest';
import { inviteMail, resetMail } from './templates.js';

describe('mail templates', () => {
  const link = 'http://127.0.0.1:3000/accept-invite?token=abc_DEF-123';
  const expiresAt = new Date('2031-05-04T10:20:30Z');

  it('puts the link and the expiry in the plain text of an invitation', () => {
    const mail = inviteMail({ studioName: 'Meridian & Vale', inviterName: 'Rosa', role: 'editor', link, expiresAt });
    expect(mail.subject).toBe('Join Meridian & Vale on Warpmeter');
    expect(mail.text).toContain(link);
    expect(mail.text).toContain('Rosa has asked you to join Meridian & Vale');
    expect(mail.text).toContain('Sun, 04 May 2031 10:20 UTC');
  });

  it('escapes names in the HTML version', () => {
    const mail = inviteMail({ studioName: '<b>Evil</b> & Co', inviterName: '"Q"', role: 'client', link, expiresAt });
    expect(mail.html).not.toContain('<b>Evil</b>');
    expect(mail.html).toContain('&#60;b&#62;Evil&#60;/b&#62; &#38; Co');
    expect(mail.html).toContain(`href="${link}"`);
  });

  it('writes a reset mail that says what happens if it was not asked for', () => {
    const mail = resetMail({ name: 'Hana', link, expiresAt });
    expect(mail.text).toMatch(/^Hello Hana,/);
    expect(mail.text).toContain(link);
    expect(mail.text).toMatch(/ignore this message: your password stays as it is/);
  });
});
