/**
 * A vehicle job's specification sheet, read back with poppler's pdftotext: each ground field is
 * named with its class and rule, its share seen as a percentage and its verdict; the test
 * cylinders, the planning line and the cautions are there.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type request from 'supertest';
import { CAUTION_SENTENCES, VEHICLE_FIELDS_NOTE } from '../../shared/cautions';
import { evaluateProject, formatFieldShare, vehicleFieldClass } from '../../shared/project-optics';
import type { ProjectDto } from '../../shared/schemas';
import { vehicleGeometry } from '../../shared/vehicle';
import { sheetFormat } from '../../server/pdf/sheet-model';
import { DEMO_SCHOOL_BUS, DEMO_TRUCK } from '../../server/seeders/demo-vehicles';
import { EMAIL, startHarness, type Harness } from './harness';
import { flat, issueSheet, popplerOn } from './pdf-tools';

type Agent = ReturnType<typeof request.agent>;
let h: Harness;
let installer: Agent;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-vehicle-sheet-'));
beforeAll(async () => {
  h = await startHarness();
  installer = await h.signedIn(EMAIL.installer);
});
afterAll(async () => {
  await h.close();
  fs.rmSync(tmp, { recursive: true, force: true });
});

async function projectNamed(name: string): Promise<ProjectDto> {
  const list = (await installer.get('/api/projects')).body.projects as { id: number; name: string }[];
  return (await installer.get(`/api/projects/${list.find((p) => p.name === name)!.id}`)).body.project;
}

/** Issues the job's sheet and returns its text as pdftotext reads it, whitespace flattened. */
async function sheetText(projectId: number): Promise<string> {
  const { pdf, res } = await issueSheet(installer, projectId);
  expect(res.status).toBe(200);
  return flat(popplerOn('pdftotext', pdf, tmp));
}

describe('the demo truck’s sheet', () => {
  let text: string;
  let truck: ProjectDto;
  beforeAll(async () => {
    truck = await projectNamed(DEMO_TRUCK.name);
    text = await sheetText(truck.id);
  });

  it('names each field with its class and rule, prints its share seen as a percentage and its verdict', () => {
    const ev = evaluateProject({ scene: truck.scene, placements: truck.placements, catalogue: [] });
    expect(ev.vehicle!.fields).toHaveLength(6);
    for (const f of ev.vehicle!.fields) {
      const needed = `${Math.round(f.field.requiredShare! * 100)} %`;
      expect(text).toContain(
        `${f.field.name} — class ${vehicleFieldClass(f.field.code)}, ${f.field.rule}: ${formatFieldShare(f.share)} seen, ${needed} needed, ${f.verdict}.`,
      );
    }
  });

  it('says the passenger-side class V field is short of the 85 % retrofit rule', () => {
    expect(text).toMatch(
      /Class V \(close-proximity\), passenger side — class V, UN Regulation No\. 46: [0-7]?\d\.\d % seen, 85 % needed, short\./,
    );
    expect(text).toContain('At least 85 % of the class V field (Directive 2007/38/EC) [P].');
  });

  it('gives each status mark’s meaning, the planning line and the cautions', () => {
    expect(text).toContain('[M] from memory, fairly sure');
    expect(text).toContain('[P] found in published text');
    expect(text).toContain(VEHICLE_FIELDS_NOTE);
    for (const c of CAUTION_SENTENCES) expect(text).toContain(c);
  });

  it('prints each mirror’s own numbers, seen from the driver’s eyes', () => {
    for (const p of DEMO_TRUCK.placements) expect(text).toContain(p.label);
    const eyeHeightM = vehicleGeometry(truck.scene.vehicle!).eyeMidM[2];
    expect(text).toContain(`the driver’s eyes, ${sheetFormat('metric').dist(eyeHeightM)} up`);
  });
});

describe('the demo school bus’s sheet', () => {
  it('lists each test cylinder with whether it is seen, and the cylinder beside the right front wheel as not seen', async () => {
    const bus = await projectNamed(DEMO_SCHOOL_BUS.name);
    const text = await sheetText(bus.id);
    for (const t of bus.scene.vehicle!.targets) expect(text).toContain(t.name);
    expect(text).toMatch(/D, beside the right front wheel not seen — — — 3\.0′ inside the edge short/);
    expect(text).toContain('These rules set no ground field for this kind of vehicle');
  });
});
