/** Every module's operations: the API document is built from this list (each module keeps its own `<module>.api.ts`). */
import type { ApiOperation } from './operation'
import { coreApi } from './core.api'
import { authApi } from '../modules/auth/auth.api'
import { usersApi } from '../modules/users/users.api'
import { officesApi } from '../modules/offices/offices.api'
import { regionsApi } from '../modules/regions/regions.api'
import { casesApi } from '../modules/cases/cases.api'
import { caseFileApi } from '../modules/case-file/case-file.api'
import { dashboardApi } from '../modules/dashboard/dashboard.api'
import { auditApi } from '../modules/audit/audit.api'
import { retentionApi } from '../modules/retention/retention.api'
import { savedViewsApi } from '../modules/saved-views/saved-views.api'
import { notificationsApi } from '../modules/notifications/notifications.api'
import { devApi } from '../modules/dev/dev.api'
import { bandLimitsApi } from '../modules/band-limits/band-limits.api'
import { calculationsApi } from '../modules/calculations/calculations.api'
import { equipmentApi } from '../modules/equipment/equipment.api'
import { measurementsApi } from '../modules/measurements/measurements.api'
import { stationsApi } from '../modules/stations/stations.api'
import { findingsApi } from '../modules/findings/findings.api'
import { evidenceApi } from '../modules/evidence/evidence.api'
import { evidenceAnalysisApi } from '../modules/evidence/processing/analysis.api'
import { evidenceBundleApi } from '../modules/evidence-bundle/evidence-bundle.api'
import { responsiblePartiesApi } from '../modules/responsible-parties/responsible-parties.api'
import { followUpsApi } from '../modules/follow-ups/follow-ups.api'

export const ALL_OPERATIONS: readonly ApiOperation[] = [
  ...coreApi,
  ...authApi,
  ...usersApi,
  ...officesApi,
  ...regionsApi,
  ...casesApi,
  ...caseFileApi,
  ...dashboardApi,
  ...auditApi,
  ...retentionApi,
  ...savedViewsApi,
  ...notificationsApi,
  ...devApi,
  ...bandLimitsApi,
  ...calculationsApi,
  ...equipmentApi,
  ...measurementsApi,
  ...stationsApi,
  ...findingsApi,
  ...evidenceApi,
  ...evidenceAnalysisApi,
  ...evidenceBundleApi,
  ...responsiblePartiesApi,
  ...followUpsApi,
]
