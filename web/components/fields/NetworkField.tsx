/**
 * The circuit of a load given by its elements, edited as a tree of parts: groups of parts in series
 * or in parallel, nested as deep as the engine takes them, and parts (resistor, inductor, capacitor)
 * whose values are typed in the user's number format with an SI prefix ("4,7 mH" in de-DE, "220 µF",
 * "1.2 kΩ"). Add a part or a group, remove, move up or down, switch a group between series and
 * parallel: every control is a button, select or text box, so keys and touch do all of it. Each
 * control is named by its place ("Inductor 1 of parallel group 2"), and so is the message at a part
 * whose value is refused; nothing is stored from a refused value (setField checks it with the engine).
 * Beside the tree, the circuit's impedance at the frequency of its supply, its power factor and the
 * power it draws, from the last solve (core/physics/network.ts, `describeNetworkLoads`): a check the
 * user can read. "Edit as text" shows the network as the file holds it, for pasting; what is pasted is
 * checked by the same engine. The tree helpers are pure and live in network-tree.ts.
 */
import { useEffect, useLayoutEffect, useMemo, useRef, useState } from 'preact/hooks';
import { describeNetworkLoads, type Project } from '../../../core/page.ts';
import { draftProblems, fieldError, lastSolved, resultsState, setField, setFieldError } from '../../state/editor.ts';
import { effectiveLocale, unitSystem } from '../../state/prefs.ts';
import { messageText } from '../problem-words.ts';
import { localeSeparators } from '../../format/parse.ts';
import { messageForField, valueAt, type NetworkSpec } from '../../editor/fields.ts';
import { FieldNotes, clearFieldErrors, describedBy, fieldId, ownerName, useFieldMessage, type FieldOwner } from './common.tsx';
import {
  PART_KINDS,
  addGroup,
  addPart,
  figureWords,
  filePath,
  moveNode,
  networkToTree,
  nodeName,
  placeNumber,
  readPartValue,
  removeNode,
  setJoin,
  setKind,
  treeToNetwork,
  valueForInput,
  valueMessage,
  whyNotRemove,
  type CircuitTree,
  type GroupNode,
  type Join,
  type NodePath,
  type PartKind,
  type PartNode,
} from './network-tree.ts';

const UNIT_NAME: Readonly<Record<PartKind, string>> = { resistor: 'ohms', inductor: 'henries', capacitor: 'farads' };

/** The control to focus once the tree has rendered after a change (ids in order of preference). */
let pendingFocus: string[] = [];

/** Problems of the draft at a path of this owner (the engine's words in the user's units). */
function problemsAt(owner: string, path: string, under = false): string[] {
  const units = unitSystem.value;
  const locale = effectiveLocale();
  return draftProblems.value
    .filter((p) => p.elementId === owner && (p.field === path || (under && p.field.startsWith(`${path}.`))))
    .map((p) => messageText(p, units, locale));
}

interface Ctx {
  owner: FieldOwner;
  spec: NetworkSpec;
  tree: CircuitTree;
  /** The id every control of a node starts with. */
  nid: (path: NodePath) => string;
  /** The file path of a node's value (a part) or list (a group), from the element. */
  pathOf: (path: NodePath) => string;
  change: (next: CircuitTree, label: string, focus: string[]) => void;
  locale: string | undefined;
}

export function NetworkField({ owner, spec }: { owner: FieldOwner; spec: NetworkSpec }) {
  const network = valueAt(owner.data, spec.path);
  const tree = useMemo(() => networkToTree(network), [network]);
  const [asText, setAsText] = useState(false);
  const message = useFieldMessage(owner.id, spec.path, spec);
  const id = fieldId(owner.id, spec.path);
  const locale = effectiveLocale();

  // Text never taken in does not outlive the form (as in NumberField).
  const pending = useRef({ owner: owner.id, path: spec.path });
  pending.current = { owner: owner.id, path: spec.path };
  useEffect(() => () => clearFieldErrors(pending.current.owner, pending.current.path), []);
  // Focus follows a change: the new part's value, the moved part's button, the next part after a removal.
  useLayoutEffect(() => {
    if (!pendingFocus.length) return;
    for (const target of pendingFocus) {
      const el = document.getElementById(target) as HTMLInputElement | HTMLButtonElement | null;
      if (el && !el.disabled) {
        el.focus();
        break;
      }
    }
    pendingFocus = [];
  });

  const write = (value: unknown, label: string): string | null => {
    clearFieldErrors(owner.id, spec.path);
    const refused = setField(owner.id, spec.path, value, `${ownerName(owner.id)}: ${label}`);
    if (refused) setFieldError(owner.id, spec.path, messageForField(spec, refused));
    return refused;
  };
  // The help's examples in the user's number format ("4,7 mH" in de-DE).
  const decimal = localeSeparators(locale).decimal;
  const help = spec.help && decimal !== '.' ? spec.help.replace(/(\d)\.(\d)/g, `$1${decimal}$2`) : spec.help;
  const textMode = asText || !tree;
  const ctx: Ctx | undefined = tree
    ? {
        owner,
        spec,
        tree,
        nid: (path) => `${id}-n${path.join('_')}`,
        pathOf: (path) => {
          const rel = filePath(tree, path);
          return rel ? `${spec.path}.${rel}` : spec.path;
        },
        change: (next, label, focus) => {
          if (write(treeToNetwork(next), label) === null) pendingFocus = focus;
        },
        locale,
      }
    : undefined;

  return (
    <fieldset class={message ? 'sf-field sf-group sf-network sf-field--invalid' : 'sf-field sf-group sf-network'} data-path={spec.path} data-testid="network-field">
      <legend class="sf-legend">{spec.label}</legend>
      <CircuitCheck ownerId={owner.id} locale={locale} />
      {!textMode && ctx && <GroupView ctx={ctx} group={ctx.tree.root} path={[]} />}
      {textMode && <TextEditor owner={owner} spec={spec} network={network} write={write} readable={!!tree} />}
      {tree && (
        <button
          type="button"
          class="sf-button sf-button--quiet sf-circuit-text-toggle"
          aria-pressed={asText ? 'true' : 'false'}
          data-testid="circuit-as-text"
          onClick={() => {
            clearFieldErrors(owner.id, spec.path);
            setAsText(!asText);
          }}
        >
          Edit as text
        </button>
      )}
      <FieldNotes helpId={`${id}-help`} help={help} messageId={`${id}-msg`} message={message} />
    </fieldset>
  );
}

/** The circuit's impedance at its supply's frequency and what it draws, from the last solve. */
function CircuitCheck({ ownerId, locale }: { ownerId: string; locale: string | undefined }) {
  const solved = lastSolved.value;
  const stale = resultsState.value === 'stale';
  const figures = useMemo(() => {
    const element = solved?.project.elements.find((e) => e.id === ownerId);
    if (!solved || element?.kind !== 'network-load') return undefined;
    // Only this load's figures (cheap: its network read and one impedance worked out).
    return describeNetworkLoads({ ...solved.project, elements: [element] } as Project, solved.result)[0];
  }, [solved, ownerId]);
  if (!figures) {
    return (
      <p class="sf-help sf-circuit-check" data-testid="circuit-check">
        The circuit's impedance shows here once the chain can be calculated.
      </p>
    );
  }
  const w = figureWords(figures, locale);
  return (
    <div class={stale ? 'sf-circuit-check sf-circuit-check--stale' : 'sf-circuit-check'} data-testid="circuit-check" data-stale={stale ? 'true' : undefined}>
      {w.open ? (
        <p>
          At <span data-testid="circuit-frequency">{w.frequency}</span> the circuit is open (its parallel parts resonate): it draws{' '}
          <span data-testid="circuit-power" data-watts={String(figures.p)}>{w.power}</span>.
        </p>
      ) : (
        <p>
          At <span data-testid="circuit-frequency">{w.frequency}</span>: Z = <span data-testid="circuit-z">{w.z}</span>, |Z| ={' '}
          <span data-testid="circuit-magnitude">{w.magnitude}</span>, power factor <span data-testid="circuit-pf">{w.pf}</span>; it draws{' '}
          <span data-testid="circuit-power" data-watts={String(figures.p)}>{w.power}</span>.
        </p>
      )}
      {stale && <p class="sf-circuit-check__stale">Out of date: the figures of the last circuit the calculation took in.</p>}
    </div>
  );
}

function GroupView({ ctx, group, path }: { ctx: Ctx; group: GroupNode; path: NodePath }) {
  const { tree, owner, spec } = ctx;
  const nid = ctx.nid(path);
  const top = path.length === 0;
  const name = nodeName(tree, path);
  const listPath = ctx.pathOf(path);
  const own = top ? [] : [fieldError(owner.id, listPath), ...problemsAt(owner.id, listPath)].filter((x): x is string => !!x);
  // A lone part at the top (the file holds no group yet): nothing to connect, so no choice shown.
  const lone = top && tree.bare && group.items.length === 1;
  const where = top ? 'the circuit' : name.charAt(0).toLowerCase() + name.slice(1);
  return (
    <div class={top ? 'sf-circuit-group sf-circuit-group--top' : 'sf-circuit-group'} role="group" aria-label={top ? 'The circuit' : name} data-testid="circuit-group" data-place={placeNumber(path)}>
      <div class="sf-circuit-group__head">
        {/* Seen: "Group 2" beside its connection; heard: "Parallel group 2" (the group's accessible name). */}
        <span class="sf-circuit-group__name" aria-hidden="true">
          {top ? 'Parts' : `Group ${placeNumber(path)}`}
        </span>
        {!lone && (
          <span class="sf-circuit-join">
            <label for={`${nid}-join`} class={top ? 'sf-circuit-join__label' : 'visually-hidden'}>
              <span class="visually-hidden">{top ? 'The circuit' : name}: </span>connected in
            </label>
            <select
              id={`${nid}-join`}
              class="sf-select sf-circuit-join__select"
              value={group.join}
              data-testid="circuit-join"
              onChange={(e) => {
                const join = (e.currentTarget as HTMLSelectElement).value as Join;
                ctx.change(setJoin(tree, path, join), `${where} in ${join}`, [`${nid}-join`]);
              }}
            >
              <option value="series">Series</option>
              <option value="parallel">Parallel</option>
            </select>
          </span>
        )}
        {!top && <NodeTools ctx={ctx} path={path} name={name} />}
      </div>
      <ol class="sf-circuit-items">
        {group.items.map((item, i) => (
          <li key={i} class="sf-circuit-item">
            {item.type === 'part' ? <PartView ctx={ctx} part={item} path={[...path, i]} /> : <GroupView ctx={ctx} group={item} path={[...path, i]} />}
          </li>
        ))}
      </ol>
      <div class="sf-circuit-group__add">
        <button
          type="button"
          class="sf-button"
          id={`${nid}-add-part`}
          data-testid="circuit-add-part"
          aria-label={`Add part to ${where}`}
          onClick={() => {
            const next = addPart(tree, path);
            // The new part's kind first: it is a resistor until the user picks another.
            ctx.change(next.tree, `added a part to ${where}`, [`${ctx.nid(next.path)}-kind`]);
          }}
        >
          Add part
        </button>
        <button
          type="button"
          class="sf-button"
          id={`${nid}-add-group`}
          data-testid="circuit-add-group"
          aria-label={`Add group to ${where}`}
          onClick={() => {
            const next = addGroup(tree, path);
            ctx.change(next.tree, `added a group to ${where}`, [`${ctx.nid(next.path)}-join`]);
          }}
        >
          Add group
        </button>
      </div>
      {own.length > 0 && (
        <p class="sf-message" role="alert" data-testid="field-message">
          {spec.label}, {where}: {own.join('; ')}
        </p>
      )}
    </div>
  );
}

/** Move up, move down and remove, for a part or a group. */
function NodeTools({ ctx, path, name }: { ctx: Ctx; path: NodePath; name: string }) {
  const { tree } = ctx;
  const nid = ctx.nid(path);
  const parent = path.slice(0, -1);
  const i = path[path.length - 1]!;
  const siblings = (() => {
    let node: GroupNode = tree.root;
    for (const j of parent) node = node.items[j] as GroupNode;
    return node.items.length;
  })();
  const notRemovable = whyNotRemove(tree, path);
  const move = (step: -1 | 1) => {
    const next = moveNode(tree, path, step);
    const to = ctx.nid(next.path);
    ctx.change(next.tree, `moved ${name} ${step < 0 ? 'up' : 'down'}`, [`${to}-${step < 0 ? 'up' : 'down'}`, `${to}-${step < 0 ? 'down' : 'up'}`]);
  };
  return (
    <span class="sf-circuit-tools">
      <button type="button" class="sf-button sf-button--quiet" id={`${nid}-up`} data-testid="circuit-up" aria-label={`Move ${name} up`} disabled={i === 0} onClick={() => move(-1)}>
        <span aria-hidden="true">↑</span>
      </button>
      <button
        type="button"
        class="sf-button sf-button--quiet"
        id={`${nid}-down`}
        data-testid="circuit-down"
        aria-label={`Move ${name} down`}
        disabled={i >= siblings - 1}
        onClick={() => move(1)}
      >
        <span aria-hidden="true">↓</span>
      </button>
      <button
        type="button"
        class="sf-button sf-button--quiet"
        id={`${nid}-remove`}
        data-testid="circuit-remove"
        aria-label={`Remove ${name}`}
        disabled={notRemovable !== null}
        title={notRemovable ?? undefined}
        onClick={() => {
          // Focus goes to the entry that takes its place, else the one before it, else the group's "Add part".
          const focus = [`${ctx.nid(path)}-kind`, `${ctx.nid(path)}-join`, `${ctx.nid([...parent, i - 1])}-kind`, `${ctx.nid([...parent, i - 1])}-join`, `${ctx.nid(parent)}-add-part`];
          ctx.change(removeNode(tree, path), `removed ${name}`, focus);
        }}
      >
        <span aria-hidden="true">✕</span>
      </button>
    </span>
  );
}

function PartView({ ctx, part, path }: { ctx: Ctx; part: PartNode; path: NodePath }) {
  const { tree, owner, spec, locale } = ctx;
  const nid = ctx.nid(path);
  const name = nodeName(tree, path);
  const valuePath = ctx.pathOf(path);
  const inputId = fieldId(owner.id, valuePath);
  const unit = PART_KINDS.find((k) => k.kind === part.kind)!.unit;
  const own = fieldError(owner.id, valuePath);
  const problem = own ?? (problemsAt(owner.id, valuePath).join('; ') || undefined);
  const messageId = `${nid}-msg`;
  return (
    <div class={problem ? 'sf-circuit-part sf-field--invalid' : 'sf-circuit-part'} role="group" aria-label={name} data-testid="circuit-part" data-place={placeNumber(path)} data-kind={part.kind}>
      <span class="sf-circuit-place" aria-hidden="true">
        {placeNumber(path)}
      </span>
      <label class="visually-hidden" for={`${nid}-kind`}>
        {name}: kind of part
      </label>
      <select
        id={`${nid}-kind`}
        class="sf-select sf-circuit-part__kind"
        value={part.kind}
        data-testid="circuit-kind"
        onChange={(e) => {
          const kind = (e.currentTarget as HTMLSelectElement).value as PartKind;
          ctx.change(setKind(tree, path, kind), `${name} made a ${kind}`, [`${nid}-kind`]);
        }}
      >
        {PART_KINDS.map((k) => (
          <option key={k.kind} value={k.kind}>
            {k.label}
          </option>
        ))}
      </select>
      <label class="visually-hidden" for={inputId}>
        {name}: value in {UNIT_NAME[part.kind]} ({unit}), an SI prefix allowed
      </label>
      <PartValue ownerId={owner.id} path={valuePath} inputId={inputId} kind={part.kind} stored={part.value} name={name} problem={problem} messageId={messageId} locale={locale} />
      <NodeTools ctx={ctx} path={path} name={name} />
      {problem && (
        <p class="sf-message" id={messageId} role="alert" data-testid="field-message">
          {spec.label}, {name.charAt(0).toLowerCase() + name.slice(1)}: {problem}
        </p>
      )}
    </div>
  );
}

/** The value of one part: what is typed stays while the field has focus or holds refused text. */
function PartValue(props: { ownerId: string; path: string; inputId: string; kind: PartKind; stored: unknown; name: string; problem: string | undefined; messageId: string; locale: string | undefined }) {
  const { ownerId, path, inputId, kind, stored, name, problem, messageId, locale } = props;
  const [typed, setTyped] = useState<string | null>(null);
  const [focused, setFocused] = useState(false);
  const storedText = valueForInput(stored, kind, locale);
  const own = fieldError(ownerId, path);
  return (
    <input
      id={inputId}
      class="sf-input sf-circuit-part__value"
      type="text"
      autoComplete="off"
      spellcheck={false}
      value={typed !== null && (focused || own !== undefined) ? typed : storedText}
      aria-invalid={problem ? 'true' : undefined}
      aria-describedby={problem ? messageId : undefined}
      data-testid="circuit-value"
      onFocus={() => {
        setFocused(true);
        if (own === undefined) setTyped(storedText);
      }}
      onBlur={() => {
        setFocused(false);
        if (fieldError(ownerId, path) === undefined) setTyped(null);
      }}
      onInput={(e) => {
        const text = (e.currentTarget as HTMLInputElement).value;
        setTyped(text);
        const reading = readPartValue(text, kind, locale);
        if (!reading.ok) {
          setFieldError(ownerId, path, reading.problem);
          return;
        }
        if (reading.value === stored) {
          setFieldError(ownerId, path, null);
          return;
        }
        const refused = setField(ownerId, path, reading.value, `${ownerName(ownerId)}: ${name} value`);
        if (refused) setFieldError(ownerId, path, valueMessage(refused, reading.value, text, locale));
      }}
    />
  );
}

/** The network as the file holds it (JSON), for pasting; checked by the engine like every edit. */
function TextEditor({ owner, spec, network, write, readable }: { owner: FieldOwner; spec: NetworkSpec; network: unknown; write: (v: unknown, label: string) => string | null; readable: boolean }) {
  const id = fieldId(owner.id, spec.path);
  const [typed, setTyped] = useState<string | null>(null);
  const stored = network === undefined ? '' : JSON.stringify(network, null, 1);
  const own = fieldError(owner.id, spec.path);
  // A file's circuit the tree cannot show: every problem the engine finds in it, here.
  const below = readable ? [] : problemsAt(owner.id, spec.path, true).filter((m) => !own || m !== own);
  return (
    <div class="sf-field">
      {!readable && (
        <p class="sf-help" id={`${id}-shape`}>
          This circuit cannot be shown as parts: correct it here, as text.
        </p>
      )}
      <label class="sf-label" for={`${id}-json`}>
        Circuit as text (JSON: resistor, inductor, capacitor, series, parallel)
      </label>
      <textarea
        id={`${id}-json`}
        class="sf-textarea sf-textarea--code"
        rows={6}
        spellcheck={false}
        value={typed !== null && own !== undefined ? typed : stored}
        aria-invalid={own || below.length ? 'true' : undefined}
        aria-describedby={describedBy(`${id}-help`, spec.help, `${id}-msg`, own)}
        data-testid="circuit-text"
        onInput={(e) => {
          const text = (e.currentTarget as HTMLTextAreaElement).value;
          setTyped(text);
          let value: unknown;
          try {
            value = JSON.parse(text);
          } catch (error) {
            setFieldError(owner.id, spec.path, `${spec.label}: not readable as JSON (${error instanceof Error ? error.message : String(error)})`);
            return;
          }
          write(value, 'circuit');
        }}
      />
      {below.length > 0 && (
        <p class="sf-message" role="alert" data-testid="field-message">
          {spec.label}: {below.join('; ')}
        </p>
      )}
    </div>
  );
}
