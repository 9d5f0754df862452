import { getResultSettingsRoute, updateResultSettingsRoute } from '@/lib/server/api/study-results';
import { toHandler } from '@/lib/server/http';
export const GET = toHandler(getResultSettingsRoute);
export const PUT = toHandler(updateResultSettingsRoute);
