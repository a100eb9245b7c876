import type { Sequelize } from 'sequelize';
import type { Models } from '../../models/index';
import { DEMO_TEAM, DEMO_USERS, DEMO_SHOP } from './demo-users';
import { studyParamsSchema, type StudyParams } from '../../../shared/schemas/index';
import { DEMO_PARTS } from './demo-studies';
import { seedDemoRunLog } from './demo-run-log';
import { summarizeStudy } from '../../services/revision-summary.service';

export interface SeedOptions {
  /** Computes a revision's summary from its params; defaults to the shared solver, as every save does. */
  summarize?: (params: StudyParams) => unknown;
}

/**
 * Inserts the demo scenario once. The demo team's slug is the marker: when it
 * exists the seed does nothing, so a second start never duplicates data.
 * Everything goes in one transaction: a failed seed leaves no half scenario.
 */
export async function seedDemo(sequelize: Sequelize, models: Models, options: SeedOptions = {}): Promise<{ created: boolean }> {
  const { User, Team, Membership, Part, Study, Revision, AuditEvent } = models;
  const summarize = options.summarize ?? ((p: StudyParams) => summarizeStudy(p, () => {}));
  if (await Team.findOne({ where: { slug: DEMO_TEAM.slug } })) return { created: false };

  await sequelize.transaction(async (transaction) => {
    const team = await Team.create(
      { slug: DEMO_TEAM.slug, name: DEMO_TEAM.name, description: `${DEMO_SHOP}: tail and pylon fairings.` },
      { transaction },
    );
    const userIds = new Map<string, number>();
    for (const demo of DEMO_USERS) {
      const [user] = await User.findOrCreate({
        where: { login: demo.login },
        defaults: { providerId: demo.providerId, login: demo.login, name: demo.name, email: demo.email, avatarUrl: null, isAdmin: demo.isAdmin },
        transaction,
      });
      userIds.set(demo.login, user.id);
      if (demo.role) await Membership.create({ teamId: team.id, userId: user.id, role: demo.role }, { transaction });
    }
    const idOf = (login: string) => userIds.get(login)!;

    for (const demoPart of DEMO_PARTS) {
      const part = await Part.create(
        {
          teamId: team.id,
          partNumber: demoPart.partNumber,
          name: demoPart.name,
          description: demoPart.description,
          baselineRevisionId: null,
          baselineNote: null,
          baselinePinnedBy: null,
          baselinePinnedAt: null,
        },
        { transaction },
      );
      const revisionIds: number[][] = [];
      for (const demoStudy of demoPart.studies) {
        const study = await Study.create(
          { teamId: team.id, partId: part.id, ownerId: idOf(demoStudy.owner), title: demoStudy.title, forkedFromRevisionId: null },
          { transaction },
        );
        const ids: number[] = [];
        let params = demoStudy.start();
        for (const [i, demoRevision] of demoStudy.revisions.entries()) {
          params = structuredClone(params);
          demoRevision.edit(params);
          // The seed obeys the same schema as every save.
          params = studyParamsSchema.parse(params);
          const revision = await Revision.create(
            {
              studyId: study.id,
              number: i + 1,
              params,
              summary: await summarize(params),
              authorId: idOf(demoRevision.author),
              message: demoRevision.message,
              basedOnNumber: i === 0 ? null : i,
              restoredFromNumber: null,
            },
            { transaction },
          );
          ids.push(revision.id);
        }
        await study.update({ latestRevisionNumber: demoStudy.revisions.length }, { transaction });
        revisionIds.push(ids);
      }
      if (demoPart.baseline) {
        const { study, revision, note, pinnedBy } = demoPart.baseline;
        await part.update(
          {
            baselineRevisionId: revisionIds[study][revision - 1],
            baselineNote: note,
            baselinePinnedBy: idOf(pinnedBy),
            baselinePinnedAt: new Date(),
          },
          { transaction },
        );
      }
    }
    await seedDemoRunLog(sequelize, transaction);
    await AuditEvent.create(
      { teamId: team.id, actorId: null, action: 'seed.demo', subjectType: 'team', subjectId: team.id, details: { shop: DEMO_SHOP } },
      { transaction },
    );
  });
  return { created: true };
}
