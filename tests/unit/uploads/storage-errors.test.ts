import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { isNotImplemented, isStorageUnavailable, ObjectMissingError, storageFailure, stripQuotes } from '@/lib/storage/objects';

// Shapes as the AWS SDK v3 throws them: service errors carry name + $metadata.httpStatusCode, socket errors a Node code.
const sdk = (name: string, status?: number) => Object.assign(new Error(name), { name, $metadata: { httpStatusCode: status } });
const socket = (code: string) => Object.assign(new Error(`connect ${code} 127.0.0.1:1`), { code });

describe('which storage failures are "try again later" (503)', () => {
  it.each([
    ['connection refused', socket('ECONNREFUSED'), true],
    ['connection reset mid-body', socket('ECONNRESET'), true],
    ['SDK timeout', sdk('TimeoutError'), true],
    ['503 Slow Down', sdk('SlowDown', 503), true],
    ['500 InternalError', sdk('InternalError', 500), true],
    ['wrapped cause', Object.assign(new Error('outer'), { cause: socket('ETIMEDOUT') }), true],
    ['501 NotImplemented (a missing feature, not an outage)', sdk('NotImplemented', 501), false],
    ['404 NoSuchKey', sdk('NoSuchKey', 404), false],
    ['403 AccessDenied', sdk('AccessDenied', 403), false],
  ])('%s → %s', (_label, error, expected) => {
    expect(isStorageUnavailable(error)).toBe(expected);
  });

  it('maps an outage to AppError service_unavailable, a missing key to ObjectMissingError, the rest unchanged', () => {
    const down = storageFailure(socket('ECONNREFUSED'));
    expect(down).toBeInstanceOf(AppError);
    expect((down as AppError).status).toBe(503);
    const missing = storageFailure(sdk('NoSuchKey', 404), 'blobs/x');
    expect(missing).toBeInstanceOf(ObjectMissingError);
    expect((missing as ObjectMissingError).key).toBe('blobs/x');
    const denied = sdk('AccessDenied', 403);
    expect(storageFailure(denied, 'k')).toBe(denied);
  });

  it('recognises NotImplemented by name or status, and strips ETag quotes', () => {
    expect(isNotImplemented(sdk('NotImplemented', 501))).toBe(true);
    expect(isNotImplemented(sdk('MethodNotAllowed', 405))).toBe(false);
    expect(stripQuotes('"79b281060d337b9b2b84ccf390adcf74"')).toBe('79b281060d337b9b2b84ccf390adcf74');
  });
});
