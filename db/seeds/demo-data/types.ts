import type { TransportDataset } from '../../../lib/schema/transport-dataset.types';

export type DemoFileRole = 'raw' | 'processed' | 'other';

/** One file as the lab's software wrote it: the exact bytes an author would upload. */
export type DemoFile = { name: string; role: DemoFileRole; bytes: Uint8Array };

/** One invented deposit: who deposits it where, its complete metadata record and its files. */
export type DemoDeposit = {
  groupSlug: 'larkspur-cryogenic' | 'tidewater-thin-films' | 'cobalt-ridge-magnetotransport';
  authorEmail: string;
  title: string;
  record: TransportDataset;
  files: DemoFile[];
  /** Publish after depositing (otherwise it stays a draft). */
  publish?: boolean;
};
