import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  canonicalJson,
  canonicalSnapshot,
  diffSnapshots,
  sha256Hex,
  snapshotHash,
} from '@/lib/audit';
import { kestrelSnapshot } from './fixtures';

describe('SHA-256', () => {
  it('matches the FIPS 180-2 example vectors', () => {
    expect(sha256Hex('abc')).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    );
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });

  it('agrees with node:crypto across block boundaries and non-ASCII text', () => {
    for (const n of [0, 1, 55, 56, 63, 64, 65, 119, 120, 1000]) {
      const text = 'Ω·µ'.repeat(n % 7) + 'x'.repeat(n);
      expect(sha256Hex(text)).toBe(createHash('sha256').update(text, 'utf8').digest('hex'));
    }
  });
});

describe('canonical JSON', () => {
  it('sorts keys, drops null and absent members, writes −0 as 0', () => {
    expect(canonicalJson({ b: 1, a: { d: null, c: [2, -0] }, e: undefined })).toBe(
      '{"a":{"c":[2,0]},"b":1}',
    );
  });

  it('refuses what cannot be hashed, naming where', () => {
    expect(() => canonicalJson({ a: { b: Number.NaN } })).toThrow(/\$\.a\.b/);
  });
});

describe('snapshot hash', () => {
  it('the same snapshot twice gives the same hash, whatever the row and key order', () => {
    const a = kestrelSnapshot();
    const b = kestrelSnapshot();
    b.terminals.reverse();
    b.terminals[0] = Object.fromEntries(
      Object.entries(b.terminals[0]!).reverse(),
    ) as (typeof b.terminals)[0];
    expect(snapshotHash(a)).toBe(snapshotHash(b));
    expect(snapshotHash(a)).toMatch(/^[0-9a-f]{64}$/);
  });

  it('the server (native) and browser (plain TypeScript) paths give the same hash', () => {
    const s = kestrelSnapshot();
    expect(snapshotHash(s)).toBe(sha256Hex(canonicalJson(canonicalSnapshot(s))));
  });

  it('null and absent optional facts hash alike (database rows against form input)', () => {
    const a = kestrelSnapshot();
    const b = kestrelSnapshot();
    b.terminals[1]!.cableId = null;
    expect(snapshotHash(a)).toBe(snapshotHash(b));
  });

  it('one terminal changed changes the hash, and the snapshot delta names the change', () => {
    const a = kestrelSnapshot();
    const b = kestrelSnapshot();
    b.terminals.find((t) => t.id === 't8')!.nominalVoltage = 48;
    expect(snapshotHash(b)).not.toBe(snapshotHash(a));
    expect(diffSnapshots(a, b)).toEqual([
      {
        entity: 'terminal',
        id: 't8',
        label: 'X2:8',
        change: 'changed',
        fields: [{ field: 'nominalVoltage', before: 24, after: 48 }],
      },
    ]);
  });

  it('a settings change changes the hash and is named', () => {
    const a = kestrelSnapshot();
    const b = kestrelSnapshot();
    b.settings.surgeLevelKv = 2;
    expect(snapshotHash(b)).not.toBe(snapshotHash(a));
    expect(diffSnapshots(a, b)).toEqual([
      {
        entity: 'settings',
        id: 'settings',
        label: 'project settings',
        change: 'changed',
        fields: [{ field: 'surgeLevelKv', before: 1, after: 2 }],
      },
    ]);
  });
});
