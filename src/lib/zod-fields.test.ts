import { describe, expect, it } from 'vitest';
import { signUpSchema } from '@shared/api/auth.schema.js';
import { updateMemberSchema } from '@shared/api/people.schema.js';
import { fieldErrors } from './zod-fields.js';

describe('fieldErrors', () => {
  it("keeps the shared schema's first message per field", () => {
    const parsed = signUpSchema.safeParse({ studioName: '', name: 'Ada', email: 'not-an-address', password: 'short' });
    expect(parsed.success).toBe(false);
    expect(fieldErrors(parsed.error!)).toEqual({
      studioName: 'Enter the studio name.',
      email: 'Enter a valid e-mail address.',
      password: 'Use at least 10 characters.',
    });
  });

  it('files a whole-object refinement under "_" for the form-level message', () => {
    const parsed = updateMemberSchema.safeParse({});
    expect(fieldErrors(parsed.error!)).toEqual({ _: 'Change the role or the status.' });
  });
});
