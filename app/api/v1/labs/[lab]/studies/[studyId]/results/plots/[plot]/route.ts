import { downloadResultsPlotRoute } from '@/lib/server/api/study-results';
import { toHandler } from '@/lib/server/http';
export const GET = toHandler(downloadResultsPlotRoute);
