/**
 * What a person reads when a request or a form breaks a schema rule stated without its own message
 * (issue 17, item 10): plain sentences naming the limit, never the library's "Too big: expected string
 * to have <=120 characters"; a schema's own message still wins. Expected texts are the product's own
 * wording (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import '../../../shared/schemas/messages';
import { createLineBody, addMemberBody } from '../../../shared/schemas/projects';
import { stationRow } from '../../../shared/schemas/stations';

const messages = (schema: z.ZodType, data: unknown) => (schema.safeParse(data).error?.issues ?? []).map((i) => `${i.path.join('.')}: ${i.message}`);

describe('plain messages for schema checks', () => {
  it('names lengths, limits, choices and unknown fields in words', () => {
    expect(messages(createLineBody, { name: 'x'.repeat(121) })).toEqual(['name: must be at most 120 characters']);
    expect(messages(addMemberBody, { userId: 'nope', role: 'owner' })).toEqual([
      'userId: must be an account id', // the schema's own message wins
      'role: must be one of "geophysicist", "field_tech", "lead", "client"',
    ]);
    expect(messages(createLineBody, { name: 'A', colour: 'red' })).toEqual([': this field is not known here: colour']);
    expect(messages(z.object({ n: z.number().max(5), list: z.array(z.number()).min(2), text: z.string() }), { n: 7, list: [1] })).toEqual([
      'n: must be at most 5',
      'list: needs at least 2 items',
      'text: is required',
    ]);
    expect(messages(z.object({ n: z.number() }), { n: 'seven' })).toEqual(['n: must be a number']);
  });

  it('never shows the library default wording', () => {
    const all = [
      ...messages(z.string().max(3), 'abcd'), ...messages(z.number().min(1), 0), ...messages(z.email(), 'x'),
      ...messages(z.array(z.number()).max(1), [1, 2]), ...messages(z.enum(['a', 'b']), 'c'), ...messages(z.strictObject({}), { k: 1 }),
    ];
    for (const m of all) expect(m).not.toMatch(/Too big|Too small|expected|Invalid|Unrecognized/);
  });

  it('leaves a schema\'s own message alone', () => {
    expect(messages(stationRow, { station: 0, x: 0, z: 0 })).toEqual(['station: must be positive']);
  });
});
