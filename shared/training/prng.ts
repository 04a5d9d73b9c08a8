import { Dec } from '../calc/decimal-math';

/** A random source: each call gives a number in [0, 1). */
export type Random = () => number;

/** Largest seed (seeds are unsigned 32-bit integers, so MariaDB stores them in an INT UNSIGNED). */
export const MAX_SEED = 4_294_967_295;

/**
 * mulberry32: a small, fast 32-bit generator. The same seed always gives the same sequence, in the
 * browser and on the server, so a problem is reproduced from its seed alone. Not for secrets.
 */
export function mulberry32(seed: number): Random {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}

/** A whole number from min to max inclusive. */
export function randomInt(random: Random, min: number, max: number): number {
  return min + Math.floor(random() * (max - min + 1));
}

/** One element of a non-empty list. */
export function pick<T>(random: Random, items: readonly T[]): T {
  if (items.length === 0) throw new Error('pick: the list is empty');
  return items[randomInt(random, 0, items.length - 1)];
}

/**
 * A decimal from min to max inclusive on a grid of `step` (all given as decimal text so the
 * result is exact, e.g. randomStep(r, '0.500', '1.500', '0.125') → "0.875").
 */
export function randomStep(random: Random, min: string, max: string, step: string): Dec {
  const lo = new Dec(min);
  const s = new Dec(step);
  const count = new Dec(max).minus(lo).div(s).floor().toNumber();
  return lo.plus(s.mul(randomInt(random, 0, count)));
}

/** A fresh seed from a random source (Math.random by default). */
export function newSeed(random: Random = Math.random): number {
  return Math.floor(random() * (MAX_SEED + 1)) >>> 0;
}

/** The seed of the n-th problem made from one base seed (stable, distinct for n = 0, 1, 2 …). */
export function childSeed(base: number, n: number): number {
  return (mulberry32((base ^ Math.imul(n + 1, 0x9e3779b1)) >>> 0)() * 4_294_967_296) >>> 0;
}
