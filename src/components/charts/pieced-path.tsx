import type { SVGProps } from 'react';
import type { PathPiece } from './series-path';

/**
 * A curve drawn as its pieces (`seriesPieces`, `bandPieces`) under one group that carries the paint, so a new
 * result rewrites, and the browser repaints, only the pieces whose points changed.
 */
export function PiecedPath({ pieces, ...paint }: { pieces: PathPiece[] } & SVGProps<SVGGElement>) {
  return (
    <g strokeLinecap="round" {...paint}>
      {pieces.map((p) => (
        <path key={p.key} d={p.d} />
      ))}
    </g>
  );
}
