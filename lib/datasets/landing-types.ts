// The shape of a dataset landing page as getLandingView() assembles it: plain JSON, safe to hand to client components.
import type { Action, DenialCode } from '@/lib/access';
import type { CitationFormat } from '@/lib/citation';
import type { QualityFlag } from '@/lib/transport/quality/types';
import type { CurvePreview, DerivedValue } from '@/lib/transport/summary/types';

export type LandingState = 'draft' | 'in_review' | 'published' | 'withdrawn';

/** A label and its value already written for people (numbers with units and SI prefixes). */
export type Fact = { label: string; value: string };

export type LandingCreator = { name: string; orcid: string | null; orcidUrl: string | null; affiliations: string[] };

/** The parts of the measurement record the page shows, read defensively (a draft may be incomplete). */
export type LandingRecord = {
  description: string | null;
  keywords: string[];
  license: { id: string; name: string; url: string } | null;
  related: { relation: string; identifier: string; href: string | null }[];
  funding: { funder: string; award: string | null }[];
  sampleName: string | null;
  sample: Fact[];
  geometry: Fact[];
  contacts: Fact[];
  measurement: Fact[];
  excitation: Fact[];
  detection: Fact[];
  environment: Fact[];
};

/** Why a section is not shown to this viewer (lib/access's refusal, in words). */
export type SectionLock = { code: DenialCode; reason: string };

export type LandingFile = {
  id: string;
  name: string;
  role: 'raw' | 'processed' | 'other';
  mediaType: string | null;
  sizeBytes: number;
  sha256: string | null;
  /** Null when the viewer may not download now (see filesLock). */
  downloadUrl: string | null;
};

/** A display unit for a plot axis: shown value = (SI value − offset) / factor. */
export type UnitOption = { ucum: string; label: string; factor: number; offset: number };

export type LandingCurveFile = { fileId: string; fileName: string; previews: CurvePreview[] };

export type LandingCurves = {
  files: LandingCurveFile[];
  /** Units each SI unit of the previews can be shown in, keyed by that SI unit (UCUM). */
  units: Record<string, UnitOption[]>;
};

export type LandingDerivedFile = {
  fileId: string;
  fileName: string;
  derived: DerivedValue[];
  notComputed: { key: string; reason: string }[];
  quality: QualityFlag[];
};

export type LandingVersionLink = {
  id: string;
  number: number;
  state: LandingState;
  title: string;
  doi: string | null;
  publishedAt: string | null;
  withdrawnAt: string | null;
  /** Set while this version's files are still under embargo (YYYY-MM-DD). */
  embargoUntil: string | null;
  current: boolean;
  href: string;
};

export type LandingView = {
  dataset: { id: string; conceptDoi: string | null; conceptDoiUrl: string | null };
  version: {
    id: string;
    number: number;
    state: LandingState;
    title: string;
    doi: string | null;
    doiUrl: string | null;
    /** True once the agency holds the DOI as registered or findable. */
    doiRegistered: boolean;
    publishedAt: string | null;
    updatedAt: string;
    isLatest: boolean;
  };
  /** Files locked until 00:00 UTC of `until` (YYYY-MM-DD); active while that instant is ahead. */
  embargo: { until: string; opensAt: string; active: boolean } | null;
  withdrawal: { at: string | null; reason: string | null } | null;
  /** Authors, group and affiliations hidden (reviewer links in anonymous mode). */
  anonymousMode: boolean;
  creators: LandingCreator[] | null;
  group: { slug: string; name: string; institution: string | null } | null;
  record: LandingRecord;
  /** The record passes the full schema (always true for a version published through Ohmstead). */
  recordComplete: boolean;
  citations: Record<CitationFormat, string> | null;
  /** Why there is no citation, when there is none. */
  citationNote: string | null;
  curves: LandingCurves | null;
  derived: LandingDerivedFile[] | null;
  curvesLock: SectionLock | null;
  analysis: { pending: number; failed: number };
  files: LandingFile[] | null;
  filesLock: SectionLock | null;
  /** Every version of the dataset this viewer may open, newest first. */
  versions: LandingVersionLink[];
  /** schema.org Dataset JSON-LD, serialised for an inline script; null where the page must not carry it. */
  jsonLd: string | null;
  allowedActions: Action[];
};
