/**
 * What the machines panel's parts share: the locale type and the refusals of a study, worded for the user.
 */
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
