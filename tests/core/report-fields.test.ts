// The project's client, site and prepared-by fields (core/model/project.ts, core/solve/validate.ts):
// optional text of at most REPORT_TEXT_MAX characters, kept through validation, refused with a
// message naming the field. The limit is a design choice: common practice (no source).
import { describe, expect, it } from 'vitest';
import { PROJECT_LEVEL } from '../../core/model/errors.ts';
import { REPORT_TEXT_MAX } from '../../core/model/project.ts';
import { validateProject } from '../../core/solve/validate.ts';
import { demoProjects } from '../../core/demos/index.ts';
import { projectJsonSchema } from '../../core/schema/json-schema.ts';

const base = demoProjects[0]!.project;

describe('client, site and prepared-by', () => {
  it('are kept through validation as given', () => {
    const checked = validateProject({ ...base, client: 'Ridge Farm Co-op', site: '12 Quarry Lane', preparedBy: 'A. Volt, lic. 4471' });
    expect(checked.ok).toBe(true);
    if (checked.ok) expect(checked.project).toMatchObject({ client: 'Ridge Farm Co-op', site: '12 Quarry Lane', preparedBy: 'A. Volt, lic. 4471' });
  });

  it('are optional: a project without them stays as it was (format 2, no key added)', () => {
    const checked = validateProject(base);
    expect(checked.ok).toBe(true);
    if (checked.ok) {
      expect(checked.project.version).toBe(2);
      expect('client' in checked.project || 'site' in checked.project || 'preparedBy' in checked.project).toBe(false);
    }
  });

  it.each(['client', 'site', 'preparedBy'])('%s: a text one character too long is refused at the field, with the limit', (field) => {
    expect(REPORT_TEXT_MAX).toBe(200);
    expect(validateProject({ ...base, [field]: 'x'.repeat(REPORT_TEXT_MAX) }).ok).toBe(true);
    const checked = validateProject({ ...base, [field]: 'x'.repeat(REPORT_TEXT_MAX + 1) });
    expect(checked.ok).toBe(false);
    if (!checked.ok) expect(checked.problems).toEqual([expect.objectContaining({ elementId: PROJECT_LEVEL, field, message: expect.stringMatching(/at most 200 characters/) })]);
  });

  it.each(['client', 'site', 'preparedBy'])('%s: a number is refused as "must be text"', (field) => {
    const checked = validateProject({ ...base, [field]: 42 });
    expect(checked.ok).toBe(false);
    if (!checked.ok) expect(checked.problems).toEqual([expect.objectContaining({ field, message: 'must be text' })]);
  });

  it('the JSON Schema states them as optional strings with the same limit', () => {
    const props = (projectJsonSchema() as { properties: Record<string, { type?: string; maxLength?: number }>; required?: string[] }).properties;
    for (const f of ['client', 'site', 'preparedBy']) {
      expect(props[f]).toMatchObject({ type: 'string', maxLength: REPORT_TEXT_MAX });
    }
  });
});
