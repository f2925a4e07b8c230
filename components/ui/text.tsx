import { Text as NativeText, type TextProps } from 'react-native';

/**
 * Text in Hairline's UI face. React Native Web otherwise falls back to the
 * system font; weight and monospaced classes placed after this one win
 * because tailwind emits font families in the config's order.
 */
export function Text({ className, ...props }: TextProps & { className?: string }) {
  return <NativeText className={`font-sans ${className ?? ''}`} {...props} />;
}
