import type { Orm } from '../db';
import { hashPassword } from '../modules/auth/passwords';
import { Organization } from '../modules/users/organization.entity';
import { User } from '../modules/users/user.entity';
import { MirrorModel } from '../modules/catalogue/mirror-model.entity';
import { assignMirror } from '../modules/catalogue/catalogue.dto';
import { Project } from '../modules/projects/project.entity';
import { Placement } from '../modules/projects/placement.entity';
import { DEMO_CATALOGUE } from './demo-catalogue';
import { DEMO_PROJECT } from './demo-project';
import { DEMO_VEHICLE_JOBS } from './demo-vehicles';
import type { EntityManager } from '@mikro-orm/knex';
import { DEMO_REVIEW_JOB } from './demo-review-job';
import { ProjectEvent } from '../modules/review/project-event.entity';
import type { FileStorage } from '../modules/files/storage';
import { addDemoPlan } from './demo-plan';

/** Demo only: listed in README.md. Never use these anywhere real. */
export const DEMO_PASSWORD = 'demo-password-1';
export const DEMO_USERS = [
  { email: 'ines.installer@sightfan-demo.example', name: 'Ines Okafor (demo installer)', role: 'installer' as const },
  { email: 'rafael.reviewer@sightfan-demo.example', name: 'Rafael Lindqvist (demo safety officer)', role: 'reviewer' as const },
  { email: 'ada.admin@sightfan-demo.example', name: 'Ada Moreau (demo admin)', role: 'admin' as const },
];

/**
 * Seeds the invented demo organisation, one user per role, the demo catalogue and the demo
 * project (being drawn up) and a small job waiting for the demo reviewer, once: if the demo organisation is
 * already there, nothing changes (so a restart keeps whatever people did). Given the uploads'
 * storage, the demo project also gets its fictional plan image as a calibrated underlay
 * (demo-plan.ts), stored as an upload is; without it (most API tests) the demo has no plan image.
 */
export async function seedDemo(orm: Orm, bcryptCost: number, storage?: FileStorage): Promise<boolean> {
  const em = orm.em.fork();
  if (await em.count(Organization, { demo: true })) return seedMissingDemoVehicles(em);
  const org = em.create(Organization, { name: 'Harbourline Cold Storage (demo)', demo: true });
  const hash = await hashPassword(DEMO_PASSWORD, bcryptCost);
  const users = DEMO_USERS.map((u) => em.create(User, { ...u, organization: org, passwordHash: hash, disabled: false, units: 'metric' }));
  const byCode = new Map<string, MirrorModel>();
  for (const item of DEMO_CATALOGUE) {
    const { mirror, ...rest } = item;
    const row = em.create(MirrorModel, {
      ...rest,
      shape: mirror.shape,
      currency: 'EUR',
      demo: true,
      notes: 'Demo catalogue item: invented figures.',
    });
    assignMirror(row, mirror);
    byCode.set(item.code, row);
  }
  const { placements, ...projectFields } = DEMO_PROJECT;
  const project = em.create(Project, { ...projectFields, owner: users[0], organization: org, demo: true });
  for (const p of placements) {
    em.create(Placement, {
      project,
      label: p.label,
      catalogueItem: byCode.get(p.code)!,
      xM: p.positionM[0],
      yM: p.positionM[1],
      heightM: p.heightM,
      azimuthRad: (p.azimuthDeg * Math.PI) / 180,
      tiltDownRad: (p.tiltDownDeg * Math.PI) / 180,
      viewerId: p.viewerId,
    });
  }
  // Sent earlier, so it is older than the cold-store project and waits in the reviewer's queue.
  const sentAt = new Date(Date.now() - DEMO_REVIEW_JOB.sentHoursAgo * 3600_000);
  const { placement: rp, sentHoursAgo: _h, ...reviewFields } = DEMO_REVIEW_JOB;
  const waiting = em.create(Project, {
    ...reviewFields,
    owner: users[0],
    organization: org,
    demo: true,
    state: 'with_reviewer',
    reviewer: users[1],
    sentAt,
  });
  em.create(Placement, {
    project: waiting,
    label: rp.label,
    catalogueItem: byCode.get(DEMO_CATALOGUE[0].code)!,
    xM: rp.positionM[0],
    yM: rp.positionM[1],
    heightM: rp.heightM,
    azimuthRad: (rp.azimuthDeg * Math.PI) / 180,
    tiltDownRad: (rp.tiltDownDeg * Math.PI) / 180,
    viewerId: rp.viewerId,
  });
  await em.flush();
  for (const [kind, summary] of [
    ['created', `Created "${waiting.name}".`],
    ['placement_added', `Added mirror "${rp.label}".`],
    ['sent', `Sent to ${users[1].name} for review.`],
  ] as const) {
    em.create(ProjectEvent, { projectId: waiting.id, kind, actorId: users[0].id, actorName: users[0].name, at: sentAt, summary });
  }
  em.create(ProjectEvent, {
    projectId: project.id,
    kind: 'created',
    actorId: users[0].id,
    actorName: users[0].name,
    summary: `Created "${project.name}".`,
  });
  await em.flush();
  await em.nativeUpdate(Project, { id: waiting.id }, { createdAt: sentAt, updatedAt: sentAt });
  addDemoVehicles(em, users[0], org);
  await em.flush();
  if (storage) await addDemoPlan(em, storage, project);
  return true;
}

/** The demo vehicle jobs (a truck and a school bus), owned by the demo installer. */
function addDemoVehicles(em: EntityManager, installer: User, org: Organization): void {
  // A minute older than the demo cold store, so that site stays first in the list (newest first).
  const stamp = new Date(Date.now() - 60_000);
  for (const job of DEMO_VEHICLE_JOBS) {
    const { placements, ...fields } = job;
    const project = em.create(Project, {
      ...fields,
      kind: 'vehicle',
      owner: installer,
      organization: org,
      demo: true,
      createdAt: stamp,
      updatedAt: stamp,
    });
    for (const p of placements) {
      em.create(Placement, {
        project,
        label: p.label,
        customMirror: p.mirror,
        xM: p.positionM[0],
        yM: p.positionM[1],
        heightM: p.heightM,
        azimuthRad: (p.azimuthDeg * Math.PI) / 180,
        tiltDownRad: (p.tiltDownDeg * Math.PI) / 180,
        mirrorClass: p.mirrorClass,
        servesFieldIds: p.servesFieldIds,
      });
    }
  }
}

/**
 * A demo database seeded before vehicle jobs existed gets the demo vehicles once: only when the
 * demo organisation has never had a demo vehicle job (a deleted demo project is not brought back
 * while the other demo vehicle remains).
 */
async function seedMissingDemoVehicles(em: EntityManager): Promise<boolean> {
  const org = await em.findOne(Organization, { demo: true });
  if (!org || (await em.count(Project, { organization: org.id, demo: true, kind: 'vehicle' }))) return false;
  const installer = await em.findOne(User, { organization: org.id, email: DEMO_USERS[0].email });
  if (!installer) return false;
  addDemoVehicles(em, installer, org);
  await em.flush();
  return true;
}
