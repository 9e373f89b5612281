/**
 * The circuit of a load given by its elements. A simple circuit (parts all in series, or all in
 * parallel) is a list: a kind and a value per part, the value as text with an SI prefix ("4.7 mH",
 * "220 µF", "1.2 kΩ"), which the engine reads (core/physics/si-prefix.ts). A nested circuit is shown as
 * its JSON text, the network exactly as the engine documents it (core/physics/network.ts).
 */
import { useState } from 'preact/hooks';
import { setField, setFieldError, fieldError } from '../../state/editor.ts';
import { messageForField, valueAt, type NetworkSpec } from '../../editor/fields.ts';
import { FieldNotes, clearFieldErrors, describedBy, engineProblems, fieldId, ownerName, useFieldMessage, type FieldOwner } from './common.tsx';

type PartKind = 'resistor' | 'inductor' | 'capacitor';
const PART_KINDS: readonly { kind: PartKind; label: string; unit: string }[] = [
  { kind: 'resistor', label: 'Resistor', unit: 'Ω' },
  { kind: 'inductor', label: 'Inductor', unit: 'H' },
  { kind: 'capacitor', label: 'Capacitor', unit: 'F' },
];
const DEFAULT_VALUE: Record<PartKind, string> = { resistor: '10 Ω', inductor: '10 mH', capacitor: '100 µF' };

interface FlatNetwork {
  join: 'series' | 'parallel';
  parts: { kind: PartKind; value: unknown }[];
  /** The network was a single part (written back as a list once a second part is added). */
  single: boolean;
}

const partOf = (x: unknown): { kind: PartKind; value: unknown } | undefined => {
  if (typeof x !== 'object' || x === null || Array.isArray(x)) return undefined;
  const keys = Object.keys(x);
  if (keys.length !== 1) return undefined;
  const kind = keys[0] as PartKind;
  return PART_KINDS.some((p) => p.kind === kind) ? { kind, value: (x as Record<string, unknown>)[kind] } : undefined;
};

/** The network as a flat list, or undefined when it nests. */
function flatten(network: unknown): FlatNetwork | undefined {
  const single = partOf(network);
  if (single) return { join: 'series', parts: [single], single: true };
  if (typeof network !== 'object' || network === null) return undefined;
  const n = network as Record<string, unknown>;
  const join = Array.isArray(n['series']) ? 'series' : Array.isArray(n['parallel']) ? 'parallel' : undefined;
  if (!join || Object.keys(n).length !== 1) return undefined;
  const parts = (n[join] as unknown[]).map(partOf);
  return parts.every((p) => p !== undefined) ? { join, parts: parts as FlatNetwork['parts'], single: false } : undefined;
}

const build = (f: FlatNetwork) => ({ [f.join]: f.parts.map((p) => ({ [p.kind]: p.value })) });

export function NetworkField({ owner, spec }: { owner: FieldOwner; spec: NetworkSpec }) {
  const network = valueAt(owner.data, spec.path);
  const flat = flatten(network);
  const message = useFieldMessage(owner.id, spec.path, spec);
  const id = fieldId(owner.id, spec.path);
  const write = (value: unknown, label: string) => {
    clearFieldErrors(owner.id, spec.path);
    const refused = setField(owner.id, spec.path, value, `${ownerName(owner.id)}: ${label}`);
    if (refused) setFieldError(owner.id, spec.path, messageForField(spec, refused));
  };
  return (
    <fieldset class={message ? 'sf-field sf-group sf-network sf-field--invalid' : 'sf-field sf-group sf-network'} data-path={spec.path} data-testid="network-field">
      <legend class="sf-legend">{spec.label}</legend>
      {flat ? <FlatEditor owner={owner} spec={spec} flat={flat} write={write} /> : <JsonEditor owner={owner} spec={spec} network={network} write={write} />}
      <FieldNotes helpId={`${id}-help`} help={spec.help} messageId={`${id}-msg`} message={message} />
    </fieldset>
  );
}

function FlatEditor({ owner, spec, flat, write }: { owner: FieldOwner; spec: NetworkSpec; flat: FlatNetwork; write: (v: unknown, label: string) => void }) {
  const id = fieldId(owner.id, spec.path);
  const pathOf = (i: number, kind: PartKind) => (flat.single ? `${spec.path}.${kind}` : `${spec.path}.${flat.join}.${i}.${kind}`);
  const change = (next: FlatNetwork, label: string) => write(next.parts.length === 1 && flat.single ? { [next.parts[0]!.kind]: next.parts[0]!.value } : build(next), label);
  return (
    <>
      <div class="sf-field">
        <label class="sf-label" for={`${id}-join`}>
          Parts connected in
        </label>
        <select
          id={`${id}-join`}
          class="sf-select"
          value={flat.join}
          onChange={(e) => write(build({ ...flat, join: (e.currentTarget as HTMLSelectElement).value as 'series' | 'parallel' }), 'circuit connection')}
        >
          <option value="series">Series</option>
          <option value="parallel">Parallel</option>
        </select>
      </div>
      <ol class="sf-parts">
        {flat.parts.map((p, i) => {
          const path = pathOf(i, p.kind);
          const problem = fieldError(owner.id, path) ?? engineProblems(owner.id, path).join('; ');
          const unit = PART_KINDS.find((k) => k.kind === p.kind)!.unit;
          const partId = `${id}-${i}`;
          return (
            <li class={problem ? 'sf-part sf-field--invalid' : 'sf-part'} key={i}>
              <label class="visually-hidden" for={`${partId}-kind`}>
                Part {i + 1}: kind
              </label>
              <select
                id={`${partId}-kind`}
                class="sf-select sf-part__kind"
                value={p.kind}
                onChange={(e) => {
                  const kind = (e.currentTarget as HTMLSelectElement).value as PartKind;
                  const parts = flat.parts.map((q, j) => (j === i ? { kind, value: DEFAULT_VALUE[kind] } : q));
                  change({ ...flat, parts }, `part ${i + 1} kind`);
                }}
              >
                {PART_KINDS.map((k) => (
                  <option key={k.kind} value={k.kind}>
                    {k.label}
                  </option>
                ))}
              </select>
              <label class="visually-hidden" for={`${partId}-value`}>
                Part {i + 1}: value, with an SI prefix ({unit})
              </label>
              <PartValue owner={owner} path={path} inputId={`${partId}-value`} index={i} stored={p.value} problem={problem || undefined} label={spec.label} />
              <span class="sf-unit" aria-hidden="true">
                {unit}
              </span>
              <button
                type="button"
                class="sf-button sf-button--quiet"
                aria-label={`Remove part ${i + 1}`}
                disabled={flat.parts.length <= 1}
                title={flat.parts.length <= 1 ? 'A circuit needs at least one part' : undefined}
                onClick={() => change({ ...flat, single: false, parts: flat.parts.filter((_q, j) => j !== i) }, `removed part ${i + 1}`)}
              >
                ✕
              </button>
              {problem && (
                <p class="sf-message" id={`${partId}-msg`} role="alert" data-testid="field-message">
                  {problem.startsWith(spec.label) ? problem : `${spec.label}, part ${i + 1}: ${problem}`}
                </p>
              )}
            </li>
          );
        })}
      </ol>
      <button type="button" class="sf-button" onClick={() => change({ ...flat, single: false, parts: [...flat.parts, { kind: 'resistor', value: DEFAULT_VALUE.resistor }] }, 'added a part')}>
        Add a part
      </button>
    </>
  );
}

function JsonEditor({ owner, spec, network, write }: { owner: FieldOwner; spec: NetworkSpec; network: unknown; write: (v: unknown, label: string) => void }) {
  const id = fieldId(owner.id, spec.path);
  const [typed, setTyped] = useState<string | null>(null);
  const stored = network === undefined ? '' : JSON.stringify(network, null, 1);
  const own = fieldError(owner.id, spec.path);
  return (
    <div class="sf-field">
      <label class="sf-label" for={`${id}-json`}>
        Nested circuit (JSON: resistor, inductor, capacitor, series, parallel)
      </label>
      <textarea
        id={`${id}-json`}
        class="sf-textarea sf-textarea--code"
        rows={6}
        spellcheck={false}
        value={typed !== null && own !== undefined ? typed : stored}
        aria-invalid={own ? 'true' : undefined}
        aria-describedby={describedBy(`${id}-help`, spec.help, `${id}-msg`, own)}
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
    </div>
  );
}

/** The value of one part: what is typed stays while the field has focus or holds refused text. */
function PartValue({ owner, path, inputId, index, stored, problem, label }: { owner: FieldOwner; path: string; inputId: string; index: number; stored: unknown; problem: string | undefined; label: string }) {
  const [typed, setTyped] = useState<string | null>(null);
  const [focused, setFocused] = useState(false);
  const storedText = typeof stored === 'number' ? String(stored) : typeof stored === 'string' ? stored : '';
  const own = fieldError(owner.id, path);
  return (
    <input
      id={inputId}
      class="sf-input sf-part__value"
      type="text"
      autoComplete="off"
      spellcheck={false}
      value={typed !== null && (focused || own !== undefined) ? typed : storedText}
      aria-invalid={problem ? 'true' : undefined}
      aria-describedby={problem ? `${inputId.replace(/-value$/, '')}-msg` : undefined}
      data-testid={`network-value-${index}`}
      onFocus={() => {
        setFocused(true);
        if (own === undefined) setTyped(storedText);
      }}
      onBlur={() => {
        setFocused(false);
        if (fieldError(owner.id, path) === undefined) setTyped(null);
      }}
      onInput={(e) => {
        const text = (e.currentTarget as HTMLInputElement).value;
        setTyped(text);
        if (text === storedText) {
          setFieldError(owner.id, path, null);
          return;
        }
        const refused = setField(owner.id, path, text, `${ownerName(owner.id)}: part ${index + 1} value`);
        if (refused) setFieldError(owner.id, path, `${label}, part ${index + 1}: ${refused}`);
      }}
    />
  );
}
