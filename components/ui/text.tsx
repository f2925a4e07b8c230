import { Text as NativeText, type TextProps } from 'react-native';

/** Any class that picks a font family of its own (see tailwind.config.js). */
const familyClass = /(^|\s)font-(sans|medium|bold|mono|mono-bold)(\s|$)/;

/**
 * Text in Hairline's UI face unless the caller picks another family.
 * React Native Web would otherwise fall back to the system font. Two family
 * classes on one element would fight by stylesheet order, so only one is set.
 */
export function Text({ className = '', ...props }: TextProps & { className?: string }) {
  return <NativeText className={familyClass.test(className) ? className : `font-sans ${className}`} {...props} />;
}
