/**
 * Finding schedule records inside one project. A record that exists in another project is
 * answered exactly like one that does not exist (404), so ids reveal nothing across projects.
 */
import { Transaction } from 'sequelize';
import { getDb, type Cabinet, type Channel, type GuardRecipe, type Strip, type Terminal } from '@/lib/db';
import { NotFoundError } from '@/lib/errors';

/** Who is writing, and in which project: what every write is scoped and logged by. */
export interface ScheduleActor {
  userId: number;
  projectId: number;
}

export async function findCabinet(projectId: number, cabinetId: number, transaction?: Transaction): Promise<Cabinet> {
  const { models } = getDb();
  const cabinet = await models.Cabinet.findOne({ where: { id: cabinetId, projectId }, transaction });
  if (!cabinet) throw new NotFoundError(`Cabinet ${cabinetId} not found in this project.`);
  return cabinet;
}

export async function findStrip(projectId: number, stripId: number, transaction?: Transaction): Promise<Strip & { cabinet: Cabinet }> {
  const { models } = getDb();
  const strip = await models.Strip.findOne({
    where: { id: stripId },
    include: [{ model: models.Cabinet, as: 'cabinet', where: { projectId }, required: true }],
    transaction,
  });
  if (!strip) throw new NotFoundError(`Strip ${stripId} not found in this project.`);
  return strip as Strip & { cabinet: Cabinet };
}

export type ScopedTerminal = Terminal & { strip: Strip & { cabinet: Cabinet } };

export async function findTerminal(projectId: number, terminalId: number, transaction?: Transaction): Promise<ScopedTerminal> {
  const { models } = getDb();
  const terminal = await models.Terminal.findOne({
    where: { id: terminalId },
    include: [
      {
        model: models.Strip,
        as: 'strip',
        required: true,
        include: [{ model: models.Cabinet, as: 'cabinet', where: { projectId }, required: true }],
      },
    ],
    transaction,
  });
  if (!terminal) throw new NotFoundError(`Terminal ${terminalId} not found in this project.`);
  return terminal as ScopedTerminal;
}

export async function findChannel(projectId: number, channelId: number, transaction?: Transaction): Promise<Channel> {
  const { models } = getDb();
  const channel = await models.Channel.findOne({ where: { id: channelId, projectId }, transaction });
  if (!channel) throw new NotFoundError(`Channel ${channelId} not found in this project.`);
  return channel;
}

export async function findGuardRecipe(projectId: number, recipeId: number, transaction?: Transaction): Promise<GuardRecipe> {
  const { models } = getDb();
  const recipe = await models.GuardRecipe.findOne({ where: { id: recipeId, projectId }, transaction });
  if (!recipe) throw new NotFoundError(`Guard recipe ${recipeId} not found in this project.`);
  return recipe;
}

let sqliteWrites: Promise<unknown> = Promise.resolve();
const BUSY_RETRIES = 5;

function isBusy(err: unknown): boolean {
  return /SQLITE_BUSY/.test(String((err as Error | undefined)?.message));
}

/**
 * Runs `fn` in one transaction: everything it writes (records and their log entries) lands
 * together or not at all. On SQLite, which takes one writer at a time and (without a busy
 * timeout) fails a second one at once with SQLITE_BUSY, this process's schedule writes are
 * queued, begin IMMEDIATE (the write lock is taken up front, so two editors cannot both read
 * and then deadlock on the upgrade), and are retried a few times when another module holds
 * the lock; `fn` re-reads everything it needs, so a retry is safe.
 */
export async function inTransaction<T>(fn: (transaction: Transaction) => Promise<T>): Promise<T> {
  const { sequelize } = getDb();
  if (sequelize.getDialect() !== 'sqlite') return sequelize.transaction(fn);
  const attempt = async (): Promise<T> => {
    for (let tries = 0; ; tries += 1) {
      try {
        return await sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, fn);
      } catch (err) {
        if (!isBusy(err) || tries >= BUSY_RETRIES) throw err;
        await new Promise((resolve) => setTimeout(resolve, 40 * (tries + 1)));
      }
    }
  };
  const run = sqliteWrites.then(attempt, attempt);
  sqliteWrites = run.catch(() => undefined);
  return run;
}
