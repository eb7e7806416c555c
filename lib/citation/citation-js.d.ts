// Minimal typings for the parts of citation-js 0.8 that Ohmstead calls (the packages ship none).
declare module '@citation-js/core' {
  export type CslItem = Record<string, unknown>;
  export class Cite {
    constructor(data: CslItem | CslItem[], options?: Record<string, unknown>);
    data: CslItem[];
    format(format: 'bibtex' | 'biblatex' | 'ris' | 'bibliography' | 'citation', options?: Record<string, unknown>): string;
    format(format: 'data', options: { format: 'object' }): CslItem[];
    format(format: string, options?: Record<string, unknown>): unknown;
  }
}
declare module '@citation-js/plugin-bibtex';
declare module '@citation-js/plugin-csl';
declare module '@citation-js/plugin-ris';
declare module '@citation-js/name' {
  export type ParsedName = {
    given?: string;
    family?: string;
    suffix?: string;
    'non-dropping-particle'?: string;
    'dropping-particle'?: string;
    literal?: string;
  };
  export function parse(name: string): ParsedName;
}
