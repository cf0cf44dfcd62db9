/** Any unknown path. */
import { NotFoundContent } from './route-error'

export function Component() {
  return <NotFoundContent />
}
