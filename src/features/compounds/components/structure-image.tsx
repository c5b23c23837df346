import { cn } from '@/components/cn';

/**
 * A structure drawing from the server (openchemlib's SVG), shown as an image:
 * an image's SVG never runs scripts or loads anything, and the page's CSP
 * allows images from data: URLs only. Lint refuses injecting markup into the
 * DOM (dangerouslySetInnerHTML, innerHTML), so this is the one way a drawing is shown.
 */
export function StructureImage({
  svg,
  alt,
  className,
}: {
  svg: string;
  alt: string;
  className?: string;
}) {
  return (
    <img
      src={`data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`}
      alt={alt}
      className={cn('block bg-paper-raised', className)}
    />
  );
}
