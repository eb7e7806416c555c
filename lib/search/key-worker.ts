// A worker thread that numbers the keys of a rebuild's versions (key-numbering.ts), so that the main thread can fill
// columns and FlexSearch with the previous batch meanwhile: the two cores share a rebuild (SearchIndex.addAll).
// The worker runs the source text of makeTokeniser and makeKeyNumbering, both self-contained, so it needs no loader
// and no file of its own in any runtime (Next's server bundle, tsx, vitest).
import { Worker } from 'node:worker_threads';
import { makeKeyNumbering, type VersionText } from './key-numbering';
import { makeTokeniser } from './tokenise';

/** New keys in number order (numbers continue from the last batch), and the batch's numbers as KeyNumbering writes them. */
export type NumberedBatch = { keys: string[]; ids: Int32Array };

/** What SearchIndex.addAll needs of a worker: numbers for each batch, in the order asked. */
export type KeyNumberer = { number(versions: VersionText[]): Promise<NumberedBatch>; stop(): void };

const SOURCE = `'use strict';
// Name-keeping helper some compilers call inside functions (esbuild's keepNames, used by tsx).
var __name = (target) => target;
const makeTokeniser = ${makeTokeniser.toString()};
const makeKeyNumbering = ${makeKeyNumbering.toString()};
const { parentPort } = require('node:worker_threads');
const numbering = makeKeyNumbering(makeTokeniser().addKeys);
parentPort.on('message', (versions) => {
  const first = numbering.size();
  const out = [];
  for (const version of versions) numbering.number(version, out);
  const keys = [];
  for (let id = first; id < numbering.size(); id++) keys.push(numbering.keyOf(id));
  const ids = Int32Array.from(out);
  parentPort.postMessage({ keys, ids }, [ids.buffer]);
});
`;

/** Starts a worker for one rebuild (stop it after), or returns null where worker threads cannot start. */
export function startKeyWorker(): KeyNumberer | null {
  let worker: Worker;
  try {
    worker = new Worker(SOURCE, { eval: true, execArgv: [] });
  } catch {
    return null;
  }
  const waiting: { resolve: (batch: NumberedBatch) => void; reject: (error: Error) => void }[] = [];
  let failure: Error | null = null;
  const fail = (error: Error) => {
    failure ??= error;
    for (const w of waiting.splice(0)) w.reject(failure);
  };
  worker.on('message', (batch: NumberedBatch) => waiting.shift()?.resolve(batch));
  worker.on('error', (error) => fail(error));
  worker.on('exit', (code) => fail(new Error(`key worker stopped (exit code ${code})`)));
  return {
    number(versions) {
      if (failure) return Promise.reject(failure);
      return new Promise((resolve, reject) => {
        waiting.push({ resolve, reject });
        worker.postMessage(versions);
      });
    },
    stop() {
      worker.removeAllListeners('exit');
      fail(new Error('key worker stopped'));
      void worker.terminate();
    },
  };
}
