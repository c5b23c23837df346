import { ComingLater } from './coming-later';

export function Component() {
  return (
    <ComingLater
      title="Compounds"
      what="Here you will enter the product, intermediates and impurities of your routes: structure, melting point, and your own measured solubility and partition data."
    />
  );
}
