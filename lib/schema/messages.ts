import type { ErrorObject } from 'ajv/dist/2020';

const TYPE_WORDS: Record<string, string> = {
  string: 'text',
  number: 'a number',
  integer: 'a whole number',
  boolean: 'yes or no (true/false)',
  object: 'a group of fields',
  array: 'a list',
  null: 'empty',
};

const FORMAT_WORDS: Record<string, string> = {
  orcid: 'ORCID iD (its last character, the check digit, does not match the other digits)',
  uri: 'web address',
  date: 'date (YYYY-MM-DD)',
  'date-time': 'date and time (ISO 8601)',
  email: 'e-mail address',
};

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
const list = (values: unknown[]) => values.map((v) => String(v)).join(', ');

/** Message for one Ajv error; `label` is the field's title, `example` the schema's first example if any. */
type MessageContext = { label: string; example?: string };
type MessageBuilder = (e: ErrorObject, ctx: MessageContext) => string;

const BUILDERS: Record<string, MessageBuilder> = {
  required: (_e, { label }) => `${label} is required.`,
  type: (e, { label }) => `${label} must be ${TYPE_WORDS[String(e.params.type)] ?? String(e.params.type)}.`,
  enum: (e, { label }) => `${label} must be one of: ${list(e.params.allowedValues as unknown[])}.`,
  const: (e, { label }) => `${label} must be ${String(e.params.allowedValue)}.`,
  minimum: (e, { label }) => `${label} must be at least ${String(e.params.limit)}.`,
  maximum: (e, { label }) => `${label} must be at most ${String(e.params.limit)}.`,
  exclusiveMinimum: (e, { label }) => `${label} must be greater than ${String(e.params.limit)}.`,
  exclusiveMaximum: (e, { label }) => `${label} must be less than ${String(e.params.limit)}.`,
  pattern: (_e, { label, example }) =>
    `${label} is not in the expected form${example ? ` (for example ${example})` : ''}.`,
  format: (e, { label }) => `${label} is not a valid ${FORMAT_WORDS[String(e.params.format)] ?? String(e.params.format)}.`,
  additionalProperties: (e, { label }) => `"${String(e.params.additionalProperty)}" is not a field of ${label}.`,
  minItems: (e, { label }) => `${label} needs at least ${plural(Number(e.params.limit), 'entry', 'entries')}.`,
  maxItems: (e, { label }) => `${label} can have at most ${plural(Number(e.params.limit), 'entry', 'entries')}.`,
  minLength: (e, { label }) =>
    Number(e.params.limit) === 1 ? `${label} must not be empty.` : `${label} must be at least ${plural(Number(e.params.limit), 'character', 'characters')}.`,
  maxLength: (e, { label }) => `${label} must be at most ${plural(Number(e.params.limit), 'character', 'characters')}.`,
  uniqueItems: (e, { label }) => {
    const [a, b] = [Number(e.params.i), Number(e.params.j)].sort((x, y) => x - y);
    return `${label} must not list the same entry twice (entries ${a + 1} and ${b + 1} are equal).`;
  },
};

/** Keywords with a plain-language message; a test checks every keyword the schema uses is here. */
export const KEYWORDS_WITH_MESSAGES: readonly string[] = Object.keys(BUILDERS);

const sentence = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

export function plainMessage(error: ErrorObject, ctx: MessageContext): string {
  const build = BUILDERS[error.keyword];
  return sentence(build ? build(error, ctx) : `${ctx.label} is not valid (${error.keyword}).`);
}
