/**
 * Setup of the `web` test project (jsdom): Testing Library's DOM matchers, a clean document
 * after each test, and the network mock listening for the whole file. A request no test
 * answered fails the test, so a component cannot quietly call an endpoint nobody expected.
 */
import '@testing-library/jest-dom/vitest'
import { cleanup } from '@testing-library/react'
import { afterAll, afterEach, beforeAll, expect } from 'vitest'
import { listen, server, unansweredRequests } from './msw-server'

// jsdom lays nothing out, so it has no scrolling; pages that scroll to the top after a step
// would log "not implemented" for every call
window.scrollTo = () => {}

beforeAll(listen)
afterEach(() => {
  cleanup()
  server.resetHandlers()
  const unanswered = unansweredRequests.splice(0)
  expect(unanswered, 'requests the page sent that no handler of the test answered').toEqual([])
})
afterAll(() => server.close())
