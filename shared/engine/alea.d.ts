// Types for the small Alea generator shipped inside seedrandom (its own typings cover only the full package).

declare module 'seedrandom/lib/alea.js' {
  interface AleaPrng {
    (): number;
    int32(): number;
    double(): number;
    quick(): number;
  }
  export default function alea(seed?: string): AleaPrng;
}
