import 'fake-indexeddb/auto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { exportBackup, restoreBackup } from '../../../src/data/backup.ts';
import type { GlintmarkDb } from '../../../src/data/db.ts';
import { removeDemoData } from '../../../src/data/demo.ts';
import { inspectionRepo, installationRepo, reflectorRepo } from '../../../src/data/repo/entities.ts';
import { computeSiteVisits } from '../../../src/data/repo/siteVisits.ts';
import { siteRepo } from '../../../src/data/repo/sites.ts';
import { BY, T0_MS, inspectionFields, installationFields, reflectorFields, siteFields, useTestDb } from '../helpers.ts';

/** The stored summary must equal one computed from scratch out of the source rows. */
async function expectConsistent(db: GlintmarkDb) {
  const bySite = (a: { siteId: string }, b: { siteId: string }) => a.siteId.localeCompare(b.siteId);
  const expected = computeSiteVisits(await db.installations.toArray(), await db.inspections.toArray()).sort(bySite);
  expect((await db.siteVisits.toArray()).sort(bySite)).toEqual(expected);
}

type Op =
  | { kind: 'install' | 'inspect'; site: number; atDay: number; demo: boolean }
  | { kind: 'moveTime'; pick: number; atDay: number }
  | { kind: 'deleteInst' | 'undeleteInst' | 'deleteSite' | 'undeleteSite' | 'deleteRefl' | 'undeleteRefl'; pick: number };

const opArb: fc.Arbitrary<Op> = fc.oneof(
  fc.record({ kind: fc.constantFrom('install' as const, 'inspect' as const), site: fc.nat(2), atDay: fc.nat(100), demo: fc.boolean() }),
  fc.record({ kind: fc.constant('moveTime' as const), pick: fc.nat(20), atDay: fc.nat(100) }),
  fc.record({ kind: fc.constantFrom('deleteInst' as const, 'undeleteInst' as const, 'deleteSite' as const, 'undeleteSite' as const, 'deleteRefl' as const, 'undeleteRefl' as const), pick: fc.nat(20) }),
);

describe('site visit summary', () => {
  const db = useTestDb();

  it('stays equal to a from-scratch computation after any sequence of writes, restore and demo removal', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(opArb, { minLength: 1, maxLength: 12 }), async (ops) => {
        await db().delete();
        await db().open();
        const sites = [];
        const refls = [];
        for (let k = 0; k < 3; k++) {
          const s = await siteRepo.create(db(), siteFields({ code: `V-${k}` }), BY);
          sites.push(s);
          refls.push(await reflectorRepo.create(db(), reflectorFields(s.id), BY));
        }
        const insts: string[] = [];
        for (const op of ops) {
          const at = T0_MS + ('atDay' in op ? op.atDay : 0) * 86_400_000;
          const tryIt = (p: Promise<unknown>) => p.catch((e: Error) => expect(e.name).toMatch(/InvalidStateForEditError|MissingReferenceError|DuplicateCodeError/));
          if (op.kind === 'install') {
            await tryIt(installationRepo.create(db(), installationFields(sites[op.site].id, refls[op.site].id, { installedAtMs: at, demo: op.demo }), BY).then((r) => insts.push(r.id)));
          } else if (op.kind === 'inspect') {
            await tryIt(inspectionRepo.create(db(), inspectionFields(sites[op.site].id, refls[op.site].id, { inspectedAtMs: at, demo: op.demo }), BY));
          } else if (insts.length && op.kind === 'moveTime') await tryIt(installationRepo.update(db(), insts[op.pick % insts.length], { installedAtMs: at }, BY));
          else if (insts.length && op.kind === 'deleteInst') await tryIt(installationRepo.softDelete(db(), insts[op.pick % insts.length], BY));
          else if (insts.length && op.kind === 'undeleteInst') await tryIt(installationRepo.undelete(db(), insts[op.pick % insts.length], BY));
          else if (op.kind === 'deleteSite') await tryIt(siteRepo.softDelete(db(), sites[op.pick % 3].id, BY));
          else if (op.kind === 'undeleteSite') await tryIt(siteRepo.undelete(db(), sites[op.pick % 3].id, BY));
          else if (op.kind === 'deleteRefl') await tryIt(reflectorRepo.softDelete(db(), refls[op.pick % 3].id, BY));
          else if (op.kind === 'undeleteRefl') await tryIt(reflectorRepo.undelete(db(), refls[op.pick % 3].id, BY));
          await expectConsistent(db());
        }
        const doc = await exportBackup(db(), { appVersion: 'test' });
        await db().siteVisits.clear(); // a stale summary must not survive a restore
        await restoreBackup(db(), doc, { replace: true });
        await expectConsistent(db());
        await removeDemoData(db());
        await expectConsistent(db());
      }),
      { numRuns: 12 },
    );
  });
});
