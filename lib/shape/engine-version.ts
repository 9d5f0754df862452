/**
 * The contour engine's version, frozen into every edition and pack. Bump it whenever the same descriptor
 * would synthesise, normalise or measure differently, so a pack can say which engine drew it.
 */
export const ENGINE_VERSION = '1.0.0';
