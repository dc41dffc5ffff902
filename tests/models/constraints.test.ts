import bcrypt from 'bcryptjs';
import { ForeignKeyConstraintError, UniqueConstraintError, ValidationError } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AppendOnlyError, type Models } from '@/models';
import { freshDb, type FreshDb } from './fresh-db';

let db: FreshDb;
let m: Models;
const hash = bcrypt.hashSync('not-a-real-password', 4);

beforeAll(async () => {
  db = await freshDb();
  m = db.models;
});
afterAll(async () => db.cleanup());

async function project(code: string) {
  return m.Project.create({ name: `Project ${code}`, code });
}

async function strip(code: string) {
  const p = await project(code);
  const cabinet = await m.Cabinet.create({ projectId: p.id, tag: '+CP1', name: 'Control panel 1' });
  const s = await m.Strip.create({ cabinetId: cabinet.id, tag: 'X1', order: 1 });
  return { project: p, cabinet, strip: s };
}

describe('User', () => {
  it('refuses a second account with the same e-mail, whatever its case', async () => {
    await m.User.create({ email: 'pell.unique@example.test', name: 'Pell', passwordHash: hash });
    await expect(
      m.User.create({
        email: ' PELL.Unique@Example.TEST ',
        name: 'Pell again',
        passwordHash: hash,
      }),
    ).rejects.toBeInstanceOf(UniqueConstraintError);
    expect(await m.User.count({ where: { email: 'pell.unique@example.test' } })).toBe(1);
  });

  it('refuses a malformed e-mail and names the field', async () => {
    const err = await m.User.create({ email: 'not-an-email', name: 'X', passwordHash: hash }).catch(
      (e: unknown) => e,
    );
    expect(err).toBeInstanceOf(ValidationError);
    expect((err as ValidationError).errors.map((e) => e.path)).toContain('email');
  });

  it('refuses a plain password in passwordHash', async () => {
    await expect(
      m.User.create({ email: 'plain@example.test', name: 'Plain', passwordHash: 'hunter2' }),
    ).rejects.toThrow(/bcrypt hash/);
  });

  it('leaves the hash out of default queries', async () => {
    const user = await m.User.findOne({ where: { email: 'pell.unique@example.test' } });
    expect(user?.get('passwordHash')).toBeUndefined();
    const withHash = await m.User.scope('withPassword').findOne({
      where: { email: 'pell.unique@example.test' },
    });
    expect(bcrypt.compareSync('not-a-real-password', withHash!.passwordHash)).toBe(true);
  });
});

describe('ProjectMember', () => {
  it('accepts only the four project roles', async () => {
    const p = await project('ROLE-1');
    const u = await m.User.create({ email: 'role@example.test', name: 'Role', passwordHash: hash });
    const err = await m.ProjectMember.create({
      userId: u.id,
      projectId: p.id,
      role: 'owner' as 'viewer',
    }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ValidationError);
    expect((err as Error).message).toMatch(
      /role must be one of: engineer, technician, reviewer, viewer/,
    );
    // admin is global (User.isAdmin), not a project role
    await expect(
      m.ProjectMember.create({ userId: u.id, projectId: p.id, role: 'admin' as 'viewer' }),
    ).rejects.toThrow(ValidationError);
  });

  it('holds one role per user per project', async () => {
    const p = await project('ROLE-2');
    const u = await m.User.create({ email: 'once@example.test', name: 'Once', passwordHash: hash });
    await m.ProjectMember.create({ userId: u.id, projectId: p.id, role: 'engineer' });
    await expect(
      m.ProjectMember.create({ userId: u.id, projectId: p.id, role: 'viewer' }),
    ).rejects.toBeInstanceOf(UniqueConstraintError);
  });

  it('refuses a membership of a user that does not exist', async () => {
    const p = await project('ROLE-3');
    await expect(
      m.ProjectMember.create({ userId: 99_999, projectId: p.id, role: 'viewer' }),
    ).rejects.toBeInstanceOf(ForeignKeyConstraintError);
  });
});

describe('Project settings', () => {
  it('defaults to the supply and test levels documented in the model', async () => {
    const p = await project('DEF-1');
    // IEC 60038: ±10 % supply tolerance; IEC 61131-2: 24 V DC +20 % = 28.8 V.
    expect(p.supplyTolerance).toBe(0.1);
    expect(p.dcSupplyMax).toBeCloseTo(24 * 1.2, 10);
    expect(p.esdLevelKv).toBe(4);
    expect(p.surgeLevelKv).toBe(1);
    expect(p.wireColourConvention).toBe('iec60204-1');
    const reread = await m.Project.findByPk(p.id);
    expect(reread?.nominalVoltage).toBe(230);
  });

  it('refuses an out-of-range tolerance and an unknown coupling', async () => {
    await expect(
      m.Project.create({ name: 'Bad', code: 'BAD-1', supplyTolerance: 1.5 }),
    ).rejects.toThrow(/supplyTolerance must be a fraction/);
    await expect(
      m.Project.create({
        name: 'Bad',
        code: 'BAD-2',
        surgeCoupling: 'line-ground' as 'line-earth',
      }),
    ).rejects.toThrow(/surgeCoupling must be one of/);
    await expect(m.Project.create({ name: 'Bad', code: 'bad code' })).rejects.toThrow(
      /code may hold/,
    );
  });
});

describe('Terminal', () => {
  it('holds one terminal per strip position and level; stacked levels share a position', async () => {
    const { strip: s } = await strip('TRM-1');
    await m.Terminal.create({
      stripId: s.id,
      position: 4,
      level: 1,
      label: 'X1:4',
      circuitClass: 'sensitive',
    });
    await m.Terminal.create({
      stripId: s.id,
      position: 4,
      level: 2,
      label: 'X1:4.2',
      circuitClass: 'hazard',
      hazardKind: 'dc-supply',
      nominalVoltage: 24,
      currentKind: 'dc',
    });
    await expect(
      m.Terminal.create({
        stripId: s.id,
        position: 4,
        level: 1,
        label: 'X1:4b',
        circuitClass: 'spare',
      }),
    ).rejects.toBeInstanceOf(UniqueConstraintError);
  });

  it('refuses position 0, level 0 and unknown classes', async () => {
    const { strip: s } = await strip('TRM-2');
    await expect(
      m.Terminal.create({ stripId: s.id, position: 0, label: 'X1:0', circuitClass: 'spare' }),
    ).rejects.toThrow(/position must be 1 or more/);
    await expect(
      m.Terminal.create({
        stripId: s.id,
        position: 1,
        level: 0,
        label: 'X1:1',
        circuitClass: 'spare',
      }),
    ).rejects.toThrow(/level must be 1 or more/);
    await expect(
      m.Terminal.create({
        stripId: s.id,
        position: 1,
        label: 'X1:1',
        circuitClass: 'live' as 'hazard',
      }),
    ).rejects.toThrow(/circuitClass must be one of/);
  });

  it('needs the electrical facts on a hazard terminal, and none on others', async () => {
    const { strip: s } = await strip('TRM-3');
    await expect(
      m.Terminal.create({ stripId: s.id, position: 1, label: 'X1:1', circuitClass: 'hazard' }),
    ).rejects.toThrow(/hazardKind is required/);
    await expect(
      m.Terminal.create({
        stripId: s.id,
        position: 1,
        label: 'X1:1',
        circuitClass: 'hazard',
        hazardKind: 'mains-line',
        nominalVoltage: 230,
        currentKind: 'ac',
      }),
    ).rejects.toThrow(/frequency is required/);
    await expect(
      m.Terminal.create({
        stripId: s.id,
        position: 1,
        label: 'X1:1',
        circuitClass: 'sensitive',
        hazardKind: 'mains-line',
      }),
    ).rejects.toThrow(/only for hazard terminals/);
  });
});

describe('GuardRecipe and Channel', () => {
  it('refuses a guard that is not the engine shape, naming the path', async () => {
    const p = await project('GRD-1');
    const err = await m.GuardRecipe.create({
      projectId: p.id,
      name: 'Broken',
      guard: {
        stages: [{ series: { kind: 'resistor', id: 'R1', resistance: '4k7' }, shunts: [] }],
        input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3 },
      } as never,
    }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(ValidationError);
    expect((err as Error).message).toContain(
      'guard.stages[0].series.resistance is required (a number in SI units).',
    );
  });

  it('refuses malformed overrides and a channel whose signal and return are one terminal', async () => {
    const { project: p, cabinet, strip: s } = await strip('GRD-2');
    const t = await m.Terminal.create({
      stripId: s.id,
      position: 1,
      label: 'X1:1',
      circuitClass: 'sensitive',
    });
    await expect(
      m.Channel.create({
        projectId: p.id,
        cabinetId: cabinet.id,
        tag: 'AI-1',
        signalType: 'current-4-20',
        signalTerminalId: t.id,
        returnTerminalId: t.id,
      }),
    ).rejects.toThrow(/must be different terminals/);
    await expect(
      m.Channel.create({
        projectId: p.id,
        cabinetId: cabinet.id,
        tag: 'AI-2',
        signalType: 'current-4-20',
        guardOverrides: { elements: { R1: { resistance: '1k' } } } as never,
      }),
    ).rejects.toThrow(/guardOverrides.elements.R1.resistance must be a number/);
    await expect(
      m.Channel.create({
        projectId: p.id,
        cabinetId: cabinet.id,
        tag: 'AI-3',
        signalType: 'analog' as 'other',
      }),
    ).rejects.toThrow(/signalType must be one of/);
  });

  it('will not delete a recipe that channels still use', async () => {
    const { project: p, cabinet } = await strip('GRD-3');
    const recipe = await m.GuardRecipe.create({
      projectId: p.id,
      name: 'Wire only',
      guard: {
        stages: [{ series: { kind: 'wire', id: 'W1', resistance: 0.1 }, shunts: [] }],
        input: { positiveRail: 24, negativeRail: 0, absMaxBeyondRail: 0.3 },
      },
    });
    await m.Channel.create({
      projectId: p.id,
      cabinetId: cabinet.id,
      tag: 'DI-1',
      signalType: 'digital-24',
      guardRecipeId: recipe.id,
    });
    await expect(recipe.destroy()).rejects.toBeInstanceOf(ForeignKeyConstraintError);
    expect(await m.GuardRecipe.findByPk(recipe.id)).not.toBeNull();
  });
});

describe('Decision and Markup', () => {
  it('needs a justification to accept a finding', async () => {
    const p = await project('DEC-1');
    const reviewer = await m.User.create({
      email: 'rev@example.test',
      name: 'Rev',
      passwordHash: hash,
    });
    const run = await m.AuditRun.create({ projectId: p.id, status: 'done' });
    const finding = await m.Finding.create({
      auditRunId: run.id,
      kind: 'stress',
      stressCase: 'ac',
      verdict: 'fails',
      reason: 'R1 overheats',
      key: 'k1',
    });
    await expect(
      m.Decision.create({
        findingId: finding.id,
        reviewerId: reviewer.id,
        outcome: 'accept',
        justification: '  ',
      }),
    ).rejects.toThrow(/justification is required/);
    await m.Decision.create({
      findingId: finding.id,
      reviewerId: reviewer.id,
      outcome: 'require-fix',
      justification: null,
    });
  });

  it('stores a replayed offline markup once (clientId is unique)', async () => {
    const { project: p, strip: s } = await strip('MRK-1');
    const tech = await m.User.create({
      email: 'tech@example.test',
      name: 'Tech',
      passwordHash: hash,
    });
    const t = await m.Terminal.create({
      stripId: s.id,
      position: 1,
      label: 'X1:1',
      circuitClass: 'sensitive',
    });
    const markup = {
      projectId: p.id,
      terminalId: t.id,
      authorId: tech.id,
      kind: 'component' as const,
      clientId: 'c0ffee00-1111',
    };
    await m.Markup.create(markup);
    await expect(m.Markup.create(markup)).rejects.toBeInstanceOf(UniqueConstraintError);
    expect(await m.Markup.count({ where: { clientId: 'c0ffee00-1111' } })).toBe(1);
  });
});

describe('AuditLog is append-only', () => {
  it('accepts new entries and refuses every update and delete path', async () => {
    const entry = await m.AuditLog.create({
      actorId: 1,
      projectId: 1,
      action: 'terminal.update',
      entity: 'Terminal',
      entityId: 7,
      detail: { from: 'X3:14' },
    });

    await expect(entry.update({ action: 'tampered' })).rejects.toBeInstanceOf(AppendOnlyError);
    await expect(entry.destroy()).rejects.toBeInstanceOf(AppendOnlyError);
    await expect(
      m.AuditLog.update({ action: 'tampered' }, { where: { id: entry.id } }),
    ).rejects.toBeInstanceOf(AppendOnlyError);
    await expect(m.AuditLog.destroy({ where: { id: entry.id } })).rejects.toBeInstanceOf(
      AppendOnlyError,
    );
    await expect(m.AuditLog.destroy({ truncate: true })).rejects.toBeInstanceOf(AppendOnlyError);

    const reread = await m.AuditLog.findByPk(entry.id);
    expect(reread?.action).toBe('terminal.update');
    expect(reread?.detail).toEqual({ from: 'X3:14' });
  });
});
