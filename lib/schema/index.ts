export type {
  FieldError,
  DeepPartial,
  TransportDatasetDraft,
  TransportDatasetValidation,
  ValidationOutcome,
  ValidateOptions,
} from './validate-transport-dataset';
export { validateTransportDataset, TRANSPORT_DATASET_SCHEMA_ID } from './validate-transport-dataset';
export type * from './transport-dataset.types';
export { isValidOrcid, orcidCheckDigit } from './orcid';
