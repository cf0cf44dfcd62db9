import { describe, expect, it } from 'vitest'
import { splitLinks } from '@/features/dev-mailbox/lib/split-links'

describe('splitLinks', () => {
  it('makes the set-password address in an e-mail a link and leaves the sentence around it', () => {
    const text = 'Choose your password: http://127.0.0.1:5173/set-password?token=abcDEF123_-x.\nThanks.'
    expect(splitLinks(text)).toEqual([
      { kind: 'text', text: 'Choose your password: ' },
      { kind: 'link', href: 'http://127.0.0.1:5173/set-password?token=abcDEF123_-x' },
      { kind: 'text', text: '.\nThanks.' },
    ])
  })

  it('returns plain text unchanged when there is no address', () => {
    expect(splitLinks('No links here.')).toEqual([{ kind: 'text', text: 'No links here.' }])
    expect(splitLinks('')).toEqual([])
  })
})
