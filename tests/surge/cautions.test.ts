/**
 * Which cautions go with a surge and fault result: each names only what the project has
 * (common practice (no source): a caution about equipment the project lacks is noise that hides the rest).
 */
import { describe, expect, it } from 'vitest';
import { demoProjects } from '../../core/demos/index.ts';
import type { Project } from '../../core/model/project.ts';
import { PLANNING_CAUTION } from '../../core/studies/backup/cautions.ts';
import { ARC_FLASH_CAUTION, DC_ARC_CAUTION, ESTIMATE_CAUTION, surgeCautions } from '../../core/studies/surge/cautions.ts';

const demo = (id: string) => demoProjects.find((d) => d.id === id)!.project as unknown as Project;

describe('surge cautions', () => {
  it('a grid-fed AC project gets the estimate and arc-flash cautions, not the battery ones', () => {
    const c = surgeCautions(demo('riverside-pump-station'));
    expect(c).toContain(ESTIMATE_CAUTION);
    expect(c).toContain(ARC_FLASH_CAUTION);
    expect(c).not.toContain(PLANNING_CAUTION);
    expect(c).not.toContain(DC_ARC_CAUTION);
  });

  it('a battery-fed project gets the battery planning and DC-arc cautions too', () => {
    const c = surgeCautions(demo('hillside-relay-hut'));
    expect(c).toEqual(expect.arrayContaining([ESTIMATE_CAUTION, PLANNING_CAUTION, DC_ARC_CAUTION, ARC_FLASH_CAUTION]));
  });
});
