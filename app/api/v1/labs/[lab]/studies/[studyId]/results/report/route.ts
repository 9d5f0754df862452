import { downloadResultsReportRoute } from '@/lib/server/api/study-results';
import { toHandler } from '@/lib/server/http';
export const GET = toHandler(downloadResultsReportRoute);
