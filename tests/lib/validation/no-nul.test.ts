// The NUL character is refused in request data wherever it sits (lib/validation/no-nul.ts).
import { describe, expect, it } from 'vitest';
import { nulIssues } from '@/lib/validation/no-nul';

const TEXT = 'Text may not contain the NUL character (\\u0000).';

describe('NUL characters in request data', () => {
  it('finds each one by its field path, in objects and arrays at any depth', () => {
    expect(nulIssues({ name: 'Boiler\0house', items: [{ tag: 'ok' }, { tag: 'A\0', notes: ['x', 'y\0'] }] })).toEqual([
      { path: 'name', message: TEXT },
      { path: 'items.1.tag', message: TEXT },
      { path: 'items.1.notes.1', message: TEXT },
    ]);
  });
  it('a field name with one in it', () => {
    expect(nulIssues({ 'a\0b': 1 })).toEqual([{ path: 'a\0b', message: 'A field name may not contain the NUL character (\\u0000).' }]);
  });
  it('a bare string', () => {
    expect(nulIssues('\0')).toEqual([{ path: '', message: TEXT }]);
  });
  it('nothing to say about text without one, numbers, booleans and null', () => {
    expect(nulIssues({ a: 'plain', b: 1, c: true, d: null, e: [1, 'two'], f: 'tab\tand\nnewline' })).toEqual([]);
    expect(nulIssues(undefined)).toEqual([]);
  });
});
