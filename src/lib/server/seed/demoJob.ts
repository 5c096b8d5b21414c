import { and, eq } from 'drizzle-orm';
import type { Database } from '../db/client';
import { assemblies, jobs, revisions } from '../db/schema';
import { builtinMaterial } from '../../materials/builtin';
import { defaultExposure, workbenchDocumentSchema, type DocLayer, type WorkbenchDocument } from '../../schemas/workbench';
import { demoClimate } from '../../moisture/index.ts';

export const DEMO_JOB_NAME = 'Harrow Lane Library re-cladding';

/** a layer from a built-in material at a thickness in mm */
function layer(id: string, key: string, thicknessMm: number, note = ''): DocLayer {
  const m = builtinMaterial(key);
  if (!m) throw new Error(`no built-in material ${key}`);
  return {
    id,
    name: m.name,
    materialRef: `builtin:${m.key}`,
    materialClass: m.materialClass,
    thickness: thicknessMm / 1000,
    conductivity: m.conductivity,
    density: m.density,
    specificHeat: m.specificHeat,
    vapourResistanceFactor: m.vapourResistanceFactor,
    source: m.source,
    note: note || m.notes,
  };
}

/** every demo build-up carries the Harrow Lane monthly climate of our own scenario, for the moisture check */
const doc = (layers: DocLayer[]): WorkbenchDocument =>
  workbenchDocumentSchema.parse({ version: 2, layers, exposure: { ...defaultExposure(), climate: demoClimate('harrow-lane') } });

/** three contrasting build-ups for the fictional 1970s library: heavy, light, and a thin metal panel */
export const DEMO_ASSEMBLIES: { name: string; element: 'wall' | 'roof'; description: string; note: string; doc: WorkbenchDocument }[] = [
  {
    name: 'West wall, brick with external insulation',
    element: 'wall',
    description: 'The existing 215 mm solid brick of the reading room, wrapped outside in rendered stone wool.',
    note: 'First build-up from the condition survey: existing brick and plaster, new rendered insulation outside.',
    doc: doc([
      layer('hw-render', 'cement-sand-render-1800', 20),
      layer('hw-wool', 'mineral-wool-render-slab-140', 120),
      layer('hw-brick', 'clay-brick-protected-1700', 215),
      layer('hw-plaster', 'gypsum-plaster-dense-1300', 13),
    ]),
  },
  {
    name: 'Stair tower, timber frame infill',
    element: 'wall',
    description: 'A light timber-frame panel replacing the stair tower’s asbestos-cement infill.',
    note: 'Light option for the stair tower; studs at 600 mm centres.',
    doc: doc([
      layer('tf-cladding', 'softwood-cladding-450', 19),
      layer('tf-membrane', 'breather-membrane-pp', 0.5),
      layer('tf-fibre', 'wood-fibre-sarking-240', 35),
      layer(
        'tf-wool',
        'mineral-wool-glass-20',
        140,
        'Glass wool between 140 mm studs at 600 mm centres, treated as one homogeneous layer: the studs (about 10 % of the area) are left out, which overstates the layer’s resistance; ISO 6946 combined method for the real value.',
      ),
      layer('tf-osb', 'osb-650', 15),
      layer('tf-board', 'gypsum-plasterboard-700', 12.5),
    ]),
  },
  {
    name: 'Plant room, metal sandwich panel',
    element: 'wall',
    description: 'Factory-made steel-faced PIR panel for the new rooftop plant enclosure.',
    note: 'Panel as offered, steel faces and PIR core; joints and fixings not modelled.',
    doc: doc([layer('sp-outer', 'steel-7800', 0.5), layer('sp-core', 'pir-32', 80), layer('sp-inner', 'steel-7800', 0.5)]),
  },
];

const VENTILATED_CLADDING_NOTE =
  'Sheathing behind a ventilated batten space and cladding: the cladding and the ventilated space are left out of the layers, as ISO 6946 and ISO 13788 allow for a well-ventilated air layer.';
const STUDS_NOTE = 'Glass wool between 140 mm studs at 600 mm centres, treated as one homogeneous layer (the studs, about 10 % of the area, are left out).';

/**
 * the timber-frame pair of the moisture check: the same stair-tower panel with plywood sheathing
 * outside, first without a vapour control layer (water accumulates at the cold plywood face under
 * the Harrow Lane climate: fails) and then with a polyethylene one behind the plasterboard (passes)
 */
export const DEMO_MOISTURE_ASSEMBLIES: typeof DEMO_ASSEMBLIES = [
  {
    name: 'Stair tower, timber frame without vapour control layer',
    element: 'wall',
    description: 'Plywood-sheathed timber frame with no vapour control layer: the option the moisture check rules out.',
    note: 'Moisture option A: plywood sheathing, glass wool, plasterboard; no vapour control layer.',
    doc: doc([layer('tv-ply', 'plywood-500', 18, VENTILATED_CLADDING_NOTE), layer('tv-wool', 'mineral-wool-glass-20', 140, STUDS_NOTE), layer('tv-board', 'gypsum-plasterboard-700', 12.5)]),
  },
  {
    name: 'Stair tower, timber frame with vapour control layer',
    element: 'wall',
    description: 'The same panel with a polyethylene vapour control layer on the warm side of the insulation.',
    note: 'Moisture option B: as option A with a 0.2 mm polyethylene vapour control layer behind the plasterboard, joints taped.',
    doc: doc([
      layer('tc-ply', 'plywood-500', 18, VENTILATED_CLADDING_NOTE),
      layer('tc-wool', 'mineral-wool-glass-20', 140, STUDS_NOTE),
      layer('tc-vcl', 'polyethylene-vcl-980', 0.2),
      layer('tc-board', 'gypsum-plasterboard-700', 12.5),
    ]),
  },
];

/** one job with the demo assemblies (three contrasting build-ups and the timber-frame moisture pair), each with revision 1; creates only what is missing */
export async function seedDemoJob(db: Database, teamId: number, authorId: string | null): Promise<number> {
  let jobId: number;
  const existing = await db.select({ id: jobs.id }).from(jobs).where(and(eq(jobs.teamId, teamId), eq(jobs.name, DEMO_JOB_NAME))).limit(1);
  if (existing[0]) {
    jobId = existing[0].id;
  } else {
    const [job] = await db
      .insert(jobs)
      .values({
        teamId,
        name: DEMO_JOB_NAME,
        reference: 'CR-2041',
        client: 'Harrow Lane Library Trust',
        location: 'Harrow Lane (fictional)',
        notes: 'Re-cladding of a 1970s branch library: keep the brick reading room, replace the stair-tower infill, enclose the rooftop plant.',
        createdBy: authorId,
      })
      .$returningId();
    jobId = job.id;
  }
  for (const a of [...DEMO_ASSEMBLIES, ...DEMO_MOISTURE_ASSEMBLIES]) {
    const found = await db.select({ id: assemblies.id }).from(assemblies).where(and(eq(assemblies.jobId, jobId), eq(assemblies.name, a.name))).limit(1);
    let assemblyId = found[0]?.id;
    if (!assemblyId) {
      const [row] = await db
        .insert(assemblies)
        .values({ jobId, name: a.name, element: a.element, description: a.description, createdBy: authorId })
        .$returningId();
      assemblyId = row.id;
    }
    const rev = await db.select({ id: revisions.id }).from(revisions).where(eq(revisions.assemblyId, assemblyId)).limit(1);
    if (!rev[0]) {
      await db.insert(revisions).values({ assemblyId, number: 1, model: a.doc, note: a.note, state: 'draft', authorId });
    }
  }
  return jobId;
}
