import { describe, expect, it } from 'vitest';
import { ApiError, issueField } from '../../../src/api/errors';
import { formProblems, mergeFieldErrors } from '../../../src/lib/formErrors';
import { roleSummary } from '../../../src/lib/format';

// Issue paths follow ../shared/API.md ("layers[1].base[3]"); zod also reports array paths.
// Which input owns an issue is our own rule (first path segment): common practice, no source.

describe('issueField', () => {
  it('takes the first segment of dotted, indexed and array paths', () => {
    expect(issueField({ path: 'layers[1].base[3]', message: '' })).toBe('layers');
    expect(issueField({ path: 'email', message: '' })).toBe('email');
    expect(issueField({ path: ['members', 0, 'role'], message: '' })).toBe('members');
    expect(issueField({ path: '', message: '' })).toBe('');
  });
});

describe('formProblems', () => {
  it('puts issues on the inputs the form has and lists the rest', () => {
    const err = new ApiError(400, 'validation_failed', 'Check the form.', [
      { path: 'site', message: 'Required' },
      { path: 'site', message: 'At most 200 characters' },
      { path: 'owner', message: 'Unknown' },
      { path: '', message: 'Body must be an object' },
    ]);
    const p = formProblems(err, ['name', 'site']);
    expect(p.summary).toBe('Check the form.');
    expect(p.fields).toEqual({ site: 'Required; At most 200 characters' });
    expect(p.other).toEqual(['owner: Unknown', 'Body must be an object']);
  });

  it('says nothing when there is no error', () => {
    expect(formProblems(null, ['name'])).toEqual({ summary: null, fields: {}, other: [] });
  });

  it('explains a network failure in plain words', () => {
    expect(formProblems(new TypeError('Failed to fetch'), ['name']).summary).toMatch(/could not reach/i);
  });
});

describe('mergeFieldErrors', () => {
  it('lets a client-side check replace the server message for the same input, and ignores empty checks', () => {
    expect(mergeFieldErrors({ email: 'taken', name: 'too long' }, { email: 'Enter an e-mail address.', name: undefined })).toEqual({
      email: 'Enter an e-mail address.',
      name: 'too long',
    });
  });
});

describe('roleSummary', () => {
  it('lists administrator first, then each project role once', () => {
    const me = {
      id: '1',
      email: 'a@b.test',
      name: 'A',
      globalRole: 'admin' as const,
      projectRoles: [
        { projectId: 'p1', projectName: 'P1', role: 'geophysicist' as const },
        { projectId: 'p2', projectName: 'P2', role: 'lead' as const },
        { projectId: 'p3', projectName: 'P3', role: 'geophysicist' as const },
      ],
    };
    expect(roleSummary(me)).toBe('Administrator · Project lead · Geophysicist');
    expect(roleSummary({ ...me, globalRole: null, projectRoles: [] })).toBe('No project roles yet');
  });
});
