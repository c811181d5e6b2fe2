/**
 * Plain-sentence messages for the checks a schema states without a message of its own, in place of
 * the library's defaults ("Too big: expected string to have <=120 characters"). Installed once, by
 * the server and by the pages, before any schema is used. A schema's own message always wins.
 */
import { z } from 'zod';
import type { $ZodRawIssue } from 'zod/v4/core';

type Issue = $ZodRawIssue;

const KIND: Record<string, string> = { string: 'text', number: 'a number', int: 'a whole number', boolean: 'yes or no', array: 'a list', object: 'a set of fields', date: 'a date' };

function plural(n: number | bigint, one: string, many: string): string {
  return `${n} ${Number(n) === 1 ? one : many}`;
}

export function plainMessage(issue: Issue): string | undefined {
  switch (issue.code) {
    case 'invalid_type':
      return issue.input === undefined ? 'is required' : `must be ${KIND[issue.expected] ?? issue.expected}`;
    case 'too_big':
      if (issue.origin === 'string') return `must be at most ${plural(issue.maximum, 'character', 'characters')}`;
      if (issue.origin === 'array' || issue.origin === 'set') return `may hold at most ${plural(issue.maximum, 'item', 'items')}`;
      return `must be ${issue.inclusive === false ? 'less than' : 'at most'} ${issue.maximum}`;
    case 'too_small':
      if (issue.origin === 'string') return Number(issue.minimum) <= 1 ? 'is required' : `must be at least ${plural(issue.minimum, 'character', 'characters')}`;
      if (issue.origin === 'array' || issue.origin === 'set') return `needs at least ${plural(issue.minimum, 'item', 'items')}`;
      return `must be ${issue.inclusive === false ? 'more than' : 'at least'} ${issue.minimum}`;
    case 'invalid_value':
      return `must be one of ${issue.values.map((v: unknown) => JSON.stringify(v)).join(', ')}`;
    case 'invalid_format':
      if (issue.format === 'email') return 'must be an e-mail address';
      if (issue.format === 'uuid') return 'must be an id as the API gives it';
      return `is not in the expected form (${issue.format})`;
    case 'unrecognized_keys':
      return `${issue.keys.length === 1 ? 'this field is' : 'these fields are'} not known here: ${issue.keys.join(', ')}`;
    case 'not_multiple_of':
      return `must be a multiple of ${issue.divisor}`;
    default:
      return undefined;
  }
}

z.config({ customError: (issue) => plainMessage(issue) });
