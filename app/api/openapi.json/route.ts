import { openApiDocument } from '@/lib/api/openapi';

// Public: the document describes the API; every route it lists checks access itself.
export const dynamic = 'force-static';

export function GET() {
  return Response.json(openApiDocument());
}
