/** The forms of the kinds the shared registry defines, in the order a person works. */
import { knownKind } from '../lib/run-estimate'
import { candidateSourcesForm } from './candidate-sources-form'
import { complianceVerdictForm } from './compliance-verdict-form'
import { coexistenceForm } from './coexistence-form'
import { eirpFitForm } from './eirp-fit-form'
import { eirpSinglePointForm } from './eirp-single-point-form'
import { exposureScreeningForm } from './exposure-screening-form'
import { sourceLocateForm } from './source-locate-form'
import type { KindForm } from './kind-form'

export const KIND_FORMS: KindForm[] = [eirpSinglePointForm, eirpFitForm, sourceLocateForm, candidateSourcesForm, complianceVerdictForm, coexistenceForm, exposureScreeningForm].filter((f) => knownKind(f.kind))

/** The kinds that run in the browser (the quick calculator): those needing no register of the server. */
export const BROWSER_KIND_FORMS: KindForm[] = KIND_FORMS.filter((f) => !f.needsServer)

export const formOf = (kind: string | null | undefined): KindForm | undefined => KIND_FORMS.find((f) => f.kind === kind)
