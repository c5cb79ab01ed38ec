/**
 * The demo town's weather, so the demo's dates and temperatures agree with each other and with
 * today (the seed is laid out relative to "now"). Alder Falls is invented; its climate is an
 * invented northern one, the shape of an inland town near the 45th parallel: early-morning lows
 * about 9 °F in the third week of January and about 57 °F in the third week of July, on a smooth
 * yearly curve. Demo only: never used to judge a reading.
 */

const DAY = 86_400_000;
const MEAN_LOW_F = 33;
const SWING_F = 24;
/** Day of the year (0 = 1 January) of the coldest mornings. */
const COLDEST_DAY = 19;

function dayOfYear(at: Date): number {
  return Math.floor((at.getTime() - Date.UTC(at.getUTCFullYear(), 0, 1)) / DAY);
}

/** The usual early-morning low on that date, °F. */
export function usualMorningLowF(at: Date): number {
  const angle = (2 * Math.PI * (dayOfYear(at) - COLDEST_DAY)) / 365.25;
  return MEAN_LOW_F - SWING_F * Math.cos(angle);
}

/** The usual afternoon high on that date, °F (about 20 °F over the morning low). */
export function usualAfternoonHighF(at: Date): number {
  return usualMorningLowF(at) + 20;
}

/** Cold season: the usual morning low is at or below freezing. */
export function isColdSeason(at: Date): boolean {
  return usualMorningLowF(at) <= 32;
}
