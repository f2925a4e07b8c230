/**
 * Space toggles a radio or checkbox (WAI-ARIA practice); React Native Web's
 * press handling only honours Space on button roles, so such controls add it.
 * Spread the result onto the Pressable (web-only prop, hence the loose type).
 */
export function spaceActivates(activate: () => void): Record<string, unknown> {
  return {
    onKeyDown: (e: { nativeEvent?: { key?: string }; key?: string; preventDefault?: () => void }) => {
      const key = e.nativeEvent?.key ?? e.key;
      if (key === ' ' || key === 'Spacebar') {
        e.preventDefault?.();
        activate();
      }
    },
  };
}
