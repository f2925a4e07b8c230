import { useWindowDimensions } from 'react-native';

/** The same 1024 px line as NativeWind's `lg:`, for choices that CSS alone cannot make. */
export function useWide(): boolean {
  return useWindowDimensions().width >= 1024;
}
