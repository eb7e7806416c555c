// Pure DataCite 4.7 record builders (no DB, Next or React).
export type * from './types';
export { DATACITE_NAMESPACE, DATACITE_SCHEMA_LOCATION } from './types';
export { buildDataCiteJson, RESOURCE_TYPE } from './build-datacite-json';
export { buildDataCiteXml, renderDataCiteXml } from './build-datacite-xml';
export { bareDoi, doiUrl, orcidUrl, isoDay } from './identifiers';
export { spdxLicence, type LicenceInfo } from './spdx-licences';
export { describeTechnicalInfo, describeMeasurementTechnique, quantityLabel } from './technical-summary';
