import type { SpdxLicense } from '@/lib/schema';

// Full names as in the SPDX License List (https://spdx.org/licenses/); each id has a page at spdx.org/licenses/<id>.html.
const NAMES: Record<SpdxLicense, string> = {
  'CC-BY-4.0': 'Creative Commons Attribution 4.0 International',
  'CC-BY-SA-4.0': 'Creative Commons Attribution Share Alike 4.0 International',
  'CC-BY-NC-4.0': 'Creative Commons Attribution Non Commercial 4.0 International',
  'CC0-1.0': 'Creative Commons Zero v1.0 Universal',
  'ODbL-1.0': 'Open Data Commons Open Database License v1.0',
  'ODC-By-1.0': 'Open Data Commons Attribution License v1.0',
  'PDDL-1.0': 'Open Data Commons Public Domain Dedication & License 1.0',
  MIT: 'MIT License',
  'Apache-2.0': 'Apache License 2.0',
  'BSD-3-Clause': 'BSD 3-Clause "New" or "Revised" License',
  'GPL-3.0-or-later': 'GNU General Public License v3.0 or later',
};

export const SPDX_LIST_URL = 'https://spdx.org/licenses/';

export type LicenceInfo = { id: SpdxLicense; name: string; url: string };

/** Name and SPDX page of a licence identifier. */
export function spdxLicence(id: SpdxLicense): LicenceInfo {
  return { id, name: NAMES[id], url: `${SPDX_LIST_URL}${id}.html` };
}
