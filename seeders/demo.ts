/**
 * Loads the demo scenario (seeders/demo-scenario.ts) into a migrated, empty database, in one
 * transaction: either all of it lands or none of it.
 */
import bcrypt from 'bcryptjs';
import type { CreationAttributes } from 'sequelize';
import type { Db } from '@/lib/db';
import type { Terminal } from '@/models/Terminal';
import { DEMO_PASSWORD, DEMO_USERS, demoScenario, type ProjectPlan } from './demo-scenario';

export interface SeedCounts {
  users: number;
  projects: number;
  memberships: number;
  recipes: number;
  cabinets: number;
  strips: number;
  terminals: number;
  channels: number;
  markups: number;
}

/** bcrypt cost for the demo accounts: the library default (10). */
const BCRYPT_COST = 10;

export async function seedDemo(db: Db): Promise<SeedCounts> {
  const { sequelize, models: m } = db;
  const counts: SeedCounts = {
    users: 0,
    projects: 0,
    memberships: 0,
    recipes: 0,
    cabinets: 0,
    strips: 0,
    terminals: 0,
    channels: 0,
    markups: 0,
  };
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, BCRYPT_COST);

  await sequelize.transaction(async (transaction) => {
    const userIds = new Map<string, number>();
    for (const u of DEMO_USERS) {
      const user = await m.User.create(
        { email: u.email, name: u.name, isAdmin: u.isAdmin, passwordHash },
        { transaction },
      );
      userIds.set(u.email, user.id);
      counts.users += 1;
    }
    const userId = (email: string): number => {
      const id = userIds.get(email);
      if (id === undefined) throw new Error(`Demo scenario names an unknown user ${email}.`);
      return id;
    };

    for (const plan of demoScenario()) {
      await seedProject(plan);
    }

    async function seedProject(plan: ProjectPlan): Promise<void> {
      const project = await m.Project.create(plan.project, { transaction });
      counts.projects += 1;
      for (const member of plan.members) {
        await m.ProjectMember.create(
          { projectId: project.id, userId: userId(member.email), role: member.role },
          { transaction },
        );
        counts.memberships += 1;
      }
      const recipeIds = new Map<string, number>();
      for (const r of plan.recipes) {
        const recipe = await m.GuardRecipe.create({ projectId: project.id, ...r }, { transaction });
        recipeIds.set(r.name, recipe.id);
        counts.recipes += 1;
      }

      const terminalIdsByLabel = new Map<string, number>();
      for (const cabinetPlan of plan.cabinets) {
        const cabinet = await m.Cabinet.create(
          {
            projectId: project.id,
            tag: cabinetPlan.tag,
            name: cabinetPlan.name,
            location: cabinetPlan.location,
          },
          { transaction },
        );
        counts.cabinets += 1;

        // Channel tag → its terminals, collected while the strips are written.
        const signalOf = new Map<string, number>();
        const returnOf = new Map<string, number>();
        const channelTerminals: Array<{ terminalId: number; tag: string }> = [];

        for (const [order, stripPlan] of cabinetPlan.strips.entries()) {
          const strip = await m.Strip.create(
            { cabinetId: cabinet.id, tag: stripPlan.tag, name: stripPlan.name, order: order + 1 },
            { transaction },
          );
          counts.strips += 1;
          for (const t of stripPlan.terminals) {
            const { channel, commonReturnOf, ...fields } = t;
            const attributes: CreationAttributes<Terminal> = { ...fields, stripId: strip.id };
            const terminal = await m.Terminal.create(attributes, { transaction });
            counts.terminals += 1;
            if (terminalIdsByLabel.has(terminal.label))
              throw new Error(`Duplicate terminal label ${terminal.label}.`);
            terminalIdsByLabel.set(terminal.label, terminal.id);
            if (channel) {
              const into = channel.as === 'signal' ? signalOf : returnOf;
              if (into.has(channel.tag))
                throw new Error(`Channel ${channel.tag} has two ${channel.as} terminals.`);
              into.set(channel.tag, terminal.id);
              channelTerminals.push({ terminalId: terminal.id, tag: channel.tag });
            }
            for (const tag of commonReturnOf ?? []) {
              if (returnOf.has(tag)) throw new Error(`Channel ${tag} has two return terminals.`);
              returnOf.set(tag, terminal.id);
            }
          }
        }

        const channelIds = new Map<string, number>();
        for (const c of cabinetPlan.channels) {
          const signalTerminalId = signalOf.get(c.tag);
          if (signalTerminalId === undefined)
            throw new Error(`Channel ${c.tag} has no signal terminal in ${cabinetPlan.tag}.`);
          let guardRecipeId: number | null = null;
          if (c.recipe !== null) {
            const id = recipeIds.get(c.recipe);
            if (id === undefined)
              throw new Error(`Channel ${c.tag} names an unknown recipe "${c.recipe}".`);
            guardRecipeId = id;
          }
          const channel = await m.Channel.create(
            {
              projectId: project.id,
              cabinetId: cabinet.id,
              tag: c.tag,
              name: c.name,
              signalType: c.signalType,
              signalTerminalId,
              returnTerminalId: returnOf.get(c.tag) ?? null,
              guardRecipeId,
              guardOverrides: c.guardOverrides ?? null,
              notes: c.notes ?? null,
            },
            { transaction },
          );
          channelIds.set(c.tag, channel.id);
          counts.channels += 1;
        }
        for (const { terminalId, tag } of channelTerminals) {
          const channelId = channelIds.get(tag);
          if (channelId === undefined)
            throw new Error(
              `Terminal refers to channel ${tag}, which the cabinet does not define.`,
            );
          await m.Terminal.update({ channelId }, { where: { id: terminalId }, transaction });
        }
      }

      for (const mk of plan.markups) {
        const terminalId = terminalIdsByLabel.get(mk.terminalLabel);
        if (terminalId === undefined)
          throw new Error(`Markup names an unknown terminal ${mk.terminalLabel}.`);
        await m.Markup.create(
          {
            projectId: project.id,
            terminalId,
            authorId: userId(mk.author),
            kind: mk.kind,
            before: mk.before,
            after: mk.after,
            note: mk.note,
            status: mk.status,
            decidedById: mk.decidedBy ? userId(mk.decidedBy) : null,
            decidedAt: mk.decidedBy ? new Date() : null,
          },
          { transaction },
        );
        counts.markups += 1;
      }

      await m.AuditLog.create(
        {
          actorId: null,
          projectId: project.id,
          action: 'demo.seed',
          entity: 'Project',
          entityId: project.id,
          detail: { code: project.code },
        },
        { transaction },
      );
    }
  });

  return counts;
}
