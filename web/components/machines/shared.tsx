/**
 * What the machines panel's parts share: the locale type, the refusals of a study worded for the user,
 * and a results table's scrolling box.
 */
import type { ComponentChildren } from 'preact';
import type { Problem } from '../../../core/page.ts';
import { draft } from '../../state/editor.ts';
import { problemLine } from '../problem-words.ts';

export type Locale = string | undefined;

export function ProblemLines({ problems }: { problems: Problem[] }) {
  return (
    // The alert on a box around the list: a list with role="alert" is no list, and its items then fail axe's listitem rule.
    <div role="alert">
      <ul class="panel-warnings">
        {problems.map((p, i) => (
          <li key={i}>
            {problemLine(p, draft.value)}
          </li>
        ))}
      </ul>
    </div>
  );
}

/**
 * A results table's scrolling box, named by its heading or by a caption line above it (given `caption`,
 * the line is written here with the id `labelledBy`): a keyboard user can scroll it (tabIndex 0), and a
 * screen reader hears the region's name.
 */
export function ScrollTable({ labelledBy, caption, children }: { labelledBy: string; caption?: ComponentChildren; children: ComponentChildren }) {
  return (
    <>
      {caption !== undefined && (
        <p id={labelledBy} class="note">
          {caption}
        </p>
      )}
      <div class="table-scroll" role="region" aria-labelledby={labelledBy} tabIndex={0}>
        {children}
      </div>
    </>
  );
}
