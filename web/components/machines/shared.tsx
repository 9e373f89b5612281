/**
 * What the machines panel's parts share: the locale type and the refusals of a study, worded for the user.
 */
import type { Problem } from '../../../core/page.ts';
import { draft } from '../../state/editor.ts';
import { problemLine } from '../problem-words.ts';

export type Locale = string | undefined;

export function ProblemLines({ problems }: { problems: Problem[] }) {
  return (
    <ul class="panel-warnings" role="alert">
      {problems.map((p, i) => (
        <li key={i}>
          {problemLine(p, draft.value)}
        </li>
      ))}
    </ul>
  );
}
