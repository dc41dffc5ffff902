import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { destroyVersioned, updateVersioned } from '@/lib/data/versioned';
import { ConflictError, NotFoundError, ValidationError } from '@/lib/errors';
import type { Models, Terminal } from '@/models';
import { freshDb, type FreshDb } from './fresh-db';

let db: FreshDb;
let m: Models;
let stripId: number;

beforeAll(async () => {
  db = await freshDb();
  m = db.models;
  const p = await m.Project.create({ name: 'Versioning', code: 'VER-1' });
  const c = await m.Cabinet.create({ projectId: p.id, tag: '+CP1', name: 'Panel' });
  stripId = (await m.Strip.create({ cabinetId: c.id, tag: 'X1' })).id;
});
afterAll(async () => db.cleanup());

let nextPosition = 1;
async function terminal(): Promise<Terminal> {
  const position = nextPosition++;
  return m.Terminal.create({
    stripId,
    position,
    label: `X1:${position}`,
    circuitClass: 'sensitive',
  });
}

describe('updateVersioned', () => {
  it('applies a change made at the current version and bumps the version', async () => {
    const t = await terminal();
    expect(t.version).toBe(0);
    const saved = await updateVersioned(m.Terminal, t.id, 0, { wireNumber: 'W-101' });
    expect(saved.version).toBe(1);
    const reread = await m.Terminal.findByPk(t.id);
    expect(reread?.wireNumber).toBe('W-101');
    expect(reread?.version).toBe(1);
  });

  it('refuses a stale version, carries the current record, and changes nothing', async () => {
    const t = await terminal();
    await updateVersioned(m.Terminal, t.id, 0, { wireColour: 'BU' }); // first editor wins
    const err = await updateVersioned(m.Terminal, t.id, 0, { wireColour: 'RD' }).catch(
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(ConflictError);
    const current = (err as ConflictError).current as { wireColour: string; version: number };
    expect(current.wireColour).toBe('BU');
    expect(current.version).toBe(1);
    expect((await m.Terminal.findByPk(t.id))?.wireColour).toBe('BU');
  });

  it('detects a write that lands between the read and the save', async () => {
    const t = await terminal();
    // Simulates a second editor saving in the gap: bump the row just before our UPDATE runs.
    m.Terminal.addHook('beforeUpdate', 'concurrentWriter', async () => {
      await db.sequelize.query(
        'UPDATE terminals SET version = version + 1, "wireNumber" = ? WHERE id = ?',
        {
          replacements: ['W-OTHER', t.id],
        },
      );
    });
    try {
      const err = await updateVersioned(m.Terminal, t.id, 0, { wireNumber: 'W-MINE' }).catch(
        (e: unknown) => e,
      );
      expect(err).toBeInstanceOf(ConflictError);
      expect(((err as ConflictError).current as { wireNumber: string }).wireNumber).toBe('W-OTHER');
    } finally {
      m.Terminal.removeHook('beforeUpdate', 'concurrentWriter');
    }
    expect((await m.Terminal.findByPk(t.id))?.wireNumber).toBe('W-OTHER');
  });

  it('turns model validation into a ValidationError naming the field', async () => {
    const t = await terminal();
    const err = await updateVersioned(m.Terminal, t.id, 0, { position: 0 }).catch(
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(ValidationError);
    expect((err as ValidationError).fieldErrors.position).toEqual(['position must be 1 or more.']);
    expect((await m.Terminal.findByPk(t.id))?.position).toBe(t.position);
  });

  it('turns a taken strip position into a ValidationError', async () => {
    const a = await terminal();
    const b = await terminal();
    const err = await updateVersioned(m.Terminal, b.id, 0, { position: a.position }).catch(
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(ValidationError);
    expect((err as ValidationError).message).toMatch(/Already in use/);
  });

  it('refuses to set id or version directly, and a missing record', async () => {
    const t = await terminal();
    await expect(updateVersioned(m.Terminal, t.id, 0, { version: 7 })).rejects.toThrow(
      /cannot be changed directly: version/,
    );
    await expect(updateVersioned(m.Terminal, t.id, -1, { notes: 'x' })).rejects.toBeInstanceOf(
      ValidationError,
    );
    await expect(updateVersioned(m.Terminal, 987_654, 0, { notes: 'x' })).rejects.toBeInstanceOf(
      NotFoundError,
    );
  });

  it('works the same for every editable model (Project)', async () => {
    const p = await m.Project.create({ name: 'Other', code: 'VER-2' });
    await updateVersioned(m.Project, p.id, 0, { ambientC: 50 });
    await expect(updateVersioned(m.Project, p.id, 0, { ambientC: 55 })).rejects.toBeInstanceOf(
      ConflictError,
    );
    expect((await m.Project.findByPk(p.id))?.ambientC).toBe(50);
  });
});

describe('destroyVersioned', () => {
  it('deletes only at the expected version', async () => {
    const t = await terminal();
    await updateVersioned(m.Terminal, t.id, 0, { notes: 'moved' });
    await expect(destroyVersioned(m.Terminal, t.id, 0)).rejects.toBeInstanceOf(ConflictError);
    expect(await m.Terminal.findByPk(t.id)).not.toBeNull();
    await destroyVersioned(m.Terminal, t.id, 1);
    expect(await m.Terminal.findByPk(t.id)).toBeNull();
  });
});
