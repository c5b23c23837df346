import { cn } from '@/components/cn';

/**
 * A structure drawing from the server. The SVG is sanitised there, and shown
 * here as an image: an image's SVG never runs scripts or loads anything.
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
