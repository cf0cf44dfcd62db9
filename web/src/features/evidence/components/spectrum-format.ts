/** How the spectrum view writes frequencies: MHz to the hertz, and widths in the unit that reads best. */
export const mhz = (hz: number, digits = 6) => `${(hz / 1e6).toFixed(digits)} MHz`

export const hzWords = (hz: number) => (hz >= 1e6 ? `${(hz / 1e6).toPrecision(4)} MHz` : hz >= 1e3 ? `${(hz / 1e3).toPrecision(4)} kHz` : `${hz.toPrecision(4)} Hz`)
