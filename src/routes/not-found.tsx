import { EmptyState } from '@/components/empty-state';
import { ButtonLink } from '@/components/button';
import { paths } from '@/paths';

export function Component() {
  return (
    <EmptyState
      title="Page not found"
      action={
        <ButtonLink to={paths.root.to()} variant="primary">
          Go to your routes
        </ButtonLink>
      }
    >
      The address may be mistyped, or the page has moved. Use the navigation on the left to find
      your way.
    </EmptyState>
  );
}
