// Numbers the keys of a version's searchable text, per field, for FlexSearch (text-match.ts): each key once per
// version, in the first field that has it (title, then head, then body). A key is indexed once and scores that field's
// weight; the version is found all the same, with a fifth fewer postings to build and keep in the benchmark corpus.
//
// makeKeyNumbering is self-contained like makeTokeniser (tokenise.ts): it is handed the tokeniser's addKeys instead of
// importing it, so its source also runs on the worker thread that keys a rebuild (key-worker.ts). Keep it so.
// Numbers rather than strings: a version's keys are de-duplicated with a stamp array instead of a Set per version,
// and a worker can send them back as one Int32Array.

/** A version's searchable text, by field: `preKeyed` are keys already (formula keys and aliases, element symbols). */
export type VersionText = { title: string; preKeyed: readonly string[]; texts: readonly string[]; body: string };

export type KeyNumbering = ReturnType<typeof makeKeyNumbering>;

export function makeKeyNumbering(addKeys: (text: string, out: string[]) => void) {
  const ids = new Map<string, number>();
  const keys: string[] = [];
  let stamp = new Uint32Array(1024);
  let generation = 0;
  const scratch: string[] = [];

  function idOf(key: string): number {
    let id = ids.get(key);
    if (id === undefined) {
      id = keys.length;
      ids.set(key, id);
      keys.push(key);
      if (id >= stamp.length) {
        const grown = new Uint32Array(stamp.length * 2);
        grown.set(stamp);
        stamp = grown;
      }
    }
    return id;
  }

  // Appends the key's number unless this version has it already.
  function take(id: number, out: number[]): void {
    if (stamp[id] === generation) return;
    stamp[id] = generation;
    out.push(id);
  }

  function addText(text: string, out: number[]): void {
    scratch.length = 0;
    addKeys(text, scratch);
    for (let i = 0; i < scratch.length; i++) take(idOf(scratch[i]), out);
  }

  /** Appends, for title, head and body in turn, the field's key count and then its key numbers. */
  function number(version: VersionText, out: number[]): void {
    if (++generation === 0xffffffff) {
      stamp.fill(0);
      generation = 1;
    }
    let at = out.length;
    out.push(0);
    addText(version.title, out);
    out[at] = out.length - at - 1;
    at = out.length;
    out.push(0);
    for (let i = 0; i < version.preKeyed.length; i++) take(idOf(version.preKeyed[i]), out);
    for (let i = 0; i < version.texts.length; i++) addText(version.texts[i], out);
    out[at] = out.length - at - 1;
    at = out.length;
    out.push(0);
    addText(version.body, out);
    out[at] = out.length - at - 1;
  }

  return {
    number,
    /** The key numbered `id`. */
    keyOf: (id: number): string => keys[id],
    /** How many keys are numbered (numbers are 0 … size − 1, in the order first met). */
    size: (): number => keys.length,
  };
}
