/** File sizes and transfer speeds for people: bytes, kB, MB, GB (1 kB = 1024 bytes, as file managers show). */
export function formatBytes(bytes: number): string {
  if (bytes >= 1024 ** 3) return `${(bytes / 1024 ** 3).toFixed(2)} GB`
  if (bytes >= 1024 ** 2) return `${(bytes / 1024 ** 2).toFixed(1)} MB`
  if (bytes >= 1024) return `${(bytes / 1024).toFixed(1)} kB`
  return `${bytes} bytes`
}

export const formatSpeed = (bytesPerSecond: number) => `${formatBytes(Math.round(bytesPerSecond))}/s`
