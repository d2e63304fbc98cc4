/** How far a signature timestamp may lie from now, either way: the SDK's default tolerance (five minutes). */
export const SIGNATURE_TOLERANCE_SECONDS = 300;

/**
 * True when the signature header's `t=` lies more than the tolerance ahead of `nowSeconds`. The SDK refuses only old
 * timestamps; one from the future would stay replayable until it falls due, so it is refused too.
 */
export function signedInTheFuture(
  header: string,
  nowSeconds: number,
  toleranceSeconds = SIGNATURE_TOLERANCE_SECONDS,
): boolean {
  // Every `t=` item is judged, whichever one a parser would keep.
  return header.split(',').some((item) => {
    const [key, value] = item.split('=');
    return key.trim() === 't' && !(Number(value) <= nowSeconds + toleranceSeconds);
  });
}
