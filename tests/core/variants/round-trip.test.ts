/**
 * The variants travel with the project: the page's export (web/storage/file-format.ts) and its import
 * keep them as they were, and the imported project compares the same (no outside source: the same
 * project must give the same figures).
 */
import { describe, expect, it } from 'vitest';
import { buildExport, exportText, parseImportText } from '../../../web/storage/file-format.ts';
import { compareVariants, demoProjects, systemVoltageVariant } from '../../../core/index.ts';
import type { Project } from '../../../core/model/project.ts';
import type { DraftProject } from '../../../web/state/draft.ts';
import { solved } from './fixtures.ts';

describe('variants in an exported file', () => {
  it('export, then import: the same variants, the same comparison', () => {
    const hillside = demoProjects.find((d) => d.id === 'hillside-relay-hut')!.project;
    const v = systemVoltageVariant(hillside, 24);
    if (!v.ok) throw new Error('refused');
    const project = { ...hillside, variants: [v.variant, { name: 'Critical loads only', note: 'the fridge and radios', remove: ['lights'] }] } as Project;
    const text = exportText(buildExport(project as unknown as DraftProject, { exportedAt: new Date('2026-12-03T12:00:00Z'), appVersion: 'test' }));
    const back = parseImportText(text);
    expect(back.ok).toBe(true);
    if (!back.ok) return;
    expect((back.project as unknown as Project).variants).toEqual(project.variants);
    const a = compareVariants(solved(project), project.variants);
    const b = compareVariants(solved(back.project as unknown as Project), (back.project as unknown as Project).variants);
    expect(b).toEqual(a);
  });
});
