/** The project's library of guard recipes: list with use counts, create, versioned update and delete, each write logged. */
import type { Transaction } from 'sequelize';
import { diffFields, logAction } from '@/lib/data/audit-log';
import { destroyVersioned, translateDbError, updateVersioned } from '@/lib/data/versioned';
import { getDb, type Attributes, type GuardRecipe } from '@/lib/db';
import { ConflictError, ValidationError } from '@/lib/errors';
import type { GuardRecipeCreate, GuardRecipeUpdate } from '@/lib/validation/guard-recipe';
import { findGuardRecipe, inTransaction, type ScheduleActor } from './scope';
import { staleChecked } from './stale';

export type GuardRecipeRow = Attributes<GuardRecipe> & { channelCount: number };

async function toRows(recipes: GuardRecipe[], transaction?: Transaction): Promise<GuardRecipeRow[]> {
  const { models } = getDb();
  if (recipes.length === 0) return [];
  const counts = (await models.Channel.count({
    where: { guardRecipeId: recipes.map((r) => r.id) },
    group: ['guardRecipeId'],
    transaction,
  })) as unknown as { guardRecipeId: number; count: number }[];
  const byRecipe = new Map(counts.map((c) => [c.guardRecipeId, Number(c.count)]));
  return recipes.map((r) => ({ ...(r.get({ plain: true }) as Attributes<GuardRecipe>), channelCount: byRecipe.get(r.id) ?? 0 }));
}

export async function listGuardRecipes(projectId: number): Promise<GuardRecipeRow[]> {
  const { models } = getDb();
  return toRows(await models.GuardRecipe.findAll({ where: { projectId }, order: [['name', 'ASC']] }));
}

async function assertNameFree(projectId: number, name: string, exceptId: number | null, transaction: Transaction) {
  const { models } = getDb();
  const other = await models.GuardRecipe.findOne({ where: { projectId, name }, transaction });
  if (other && other.id !== exceptId) {
    throw new ValidationError(`A guard recipe named "${name}" already exists in this project.`, {
      name: [`"${name}" is already used by another recipe in this project.`],
    });
  }
}

export async function createGuardRecipe(actor: ScheduleActor, input: GuardRecipeCreate): Promise<GuardRecipeRow> {
  const { models } = getDb();
  const recipe = await inTransaction(async (transaction) => {
    await assertNameFree(actor.projectId, input.name, null, transaction);
    const created = await models.GuardRecipe.create(
      { projectId: actor.projectId, name: input.name, description: input.description ?? null, guard: input.guard },
      { transaction },
    ).catch((err) => {
      throw translateDbError(err);
    });
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'guard-recipe.create', entity: 'GuardRecipe', entityId: created.id, detail: { name: created.name } },
      transaction,
    );
    return created;
  });
  return (await toRows([recipe]))[0];
}

export async function updateGuardRecipe(actor: ScheduleActor, recipeId: number, update: GuardRecipeUpdate): Promise<GuardRecipeRow> {
  const { models } = getDb();
  const { version, ...changes } = update;
  const saved = await inTransaction(async (transaction) => {
    const before = await findGuardRecipe(actor.projectId, recipeId, transaction);
    if (changes.name !== undefined) await assertNameFree(actor.projectId, changes.name, recipeId, transaction);
    const diff = diffFields(before.get({ plain: true }), changes);
    const after = await staleChecked('GuardRecipe', recipeId, () => updateVersioned(models.GuardRecipe, recipeId, version, changes, { transaction }), transaction);
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'guard-recipe.update', entity: 'GuardRecipe', entityId: recipeId, detail: { name: after.name, changes: diff } },
      transaction,
    );
    return after;
  });
  return (await toRows([saved]))[0];
}

/** Refuses while channels use the recipe: removing it would leave them silently unprotected. */
export async function deleteGuardRecipe(actor: ScheduleActor, recipeId: number, version: number): Promise<void> {
  const { models } = getDb();
  await inTransaction(async (transaction) => {
    const recipe = await findGuardRecipe(actor.projectId, recipeId, transaction);
    const users = await models.Channel.findAll({ where: { guardRecipeId: recipeId }, attributes: ['tag'], order: [['tag', 'ASC']], transaction });
    if (users.length > 0) {
      const tags = users.slice(0, 5).map((c) => c.tag).join(', ') + (users.length > 5 ? ` and ${users.length - 5} more` : '');
      throw new ConflictError(
        `Guard recipe "${recipe.name}" is used by ${users.length} channel${users.length === 1 ? '' : 's'} (${tags}); give them another recipe first.`,
        (await toRows([recipe], transaction))[0],
      );
    }
    await staleChecked('GuardRecipe', recipeId, () => destroyVersioned(models.GuardRecipe, recipeId, version, { transaction }), transaction);
    await logAction(
      { actorId: actor.userId, projectId: actor.projectId, action: 'guard-recipe.delete', entity: 'GuardRecipe', entityId: recipeId, detail: { name: recipe.name } },
      transaction,
    );
  });
}
