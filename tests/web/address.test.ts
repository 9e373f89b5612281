// The address hash (issue 15, point 12): a damaged %-escape in #project=… or #demo=… opens the app
// with a message instead of throwing (decodeURIComponent throws URIError on a malformed escape:
// ECMA-262, Decode). The demo id is the project's own invented demo.
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import { addressProblem, decodeHashValue, demoIdFromHash, hashForDemo } from '../../web/state/address.ts';

const hostile = ['#project=%E0%A4%A', '#demo=%', '#demo=%E0%A4%A', '#project=%', '#project=%ZZ', '#demo=%ED%A0%80'];

describe('address hash parsing', () => {
  it.each(hostile)('%s is read without throwing, with a message', (hash) => {
    expect(() => demoIdFromHash(hash)).not.toThrow();
    expect(demoIdFromHash(hash)).toBeUndefined();
    expect(addressProblem(hash)).toMatch(/cannot read .*opened without it/);
  });

  it('a good address has no problem and still opens its demo', () => {
    const id = demoProjects[0]!.id;
    expect(addressProblem(hashForDemo(id))).toBeNull();
    expect(demoIdFromHash(hashForDemo(id))).toBe(id);
    expect(addressProblem('#project=5b0c-11aa')).toBeNull();
    expect(addressProblem('')).toBeNull();
    expect(addressProblem('#somewhere-else=%')).toBeNull();
    expect(decodeHashValue('caf%C3%A9')).toBe('café');
  });
});
