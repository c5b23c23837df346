import { ComingLater } from './coming-later';

export function Component() {
  return (
    <ComingLater
      title="Solvent library"
      what="Here you will find the solvents routes can use, with boiling point, density, flash point and residual-solvent class, each with its source."
    />
  );
}
