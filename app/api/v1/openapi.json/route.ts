import { route } from '@/lib/http/handler';
import { openApiResponse } from '@/lib/openapi/serve-openapi';

/** GET → the OpenAPI 3.1 document of /api/v1 (public; 304 when If-None-Match matches its ETag). */
export const GET = route(async (req) => openApiResponse(req));
