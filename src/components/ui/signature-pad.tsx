import { useEffect, useId, useImperativeHandle, useRef, useState, type Ref } from 'react';
import SignaturePadEngine, { type PointGroup } from 'signature_pad';
import { CircleCheck, CircleDashed, Eraser, Undo2 } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { FieldErrorMessage } from '@/components/ui/form-field';
import { LiveMessage } from '@/components/ui/live-message';
import {
  fitFactor,
  maxDataUrlLength,
  scaleStrokes,
  type PadSize,
} from '@/components/ui/signature-strokes';
import { cn } from '@/utils/cn';

/** What a form may ask of the pad: focus after a failed check, and the drawing as a PNG. */
export type SignaturePadHandle = {
  focus: () => void;
  clear: () => void;
  isEmpty: () => boolean;
  /** The drawing as a PNG data URL, or '' while nothing is drawn. */
  toDataUrl: () => string;
};

type SignaturePadProps = {
  /** Names the pad and its buttons: "Engineer’s signature", "Your signature". */
  label: string;
  /** When a heading right above already says the label, it is kept for screen readers only. */
  labelVisuallyHidden?: boolean;
  /** Called with the PNG data URL after each stroke, undo, clear or resize; '' when empty. */
  onChange: (image: string) => void;
  /** Why the drawing cannot be saved yet, shown under the pad. */
  error?: string;
  /** Keeps the PNG under this size (the API's limit) by exporting at a lower resolution. */
  maxImageBytes?: number;
  disabled?: boolean;
  ref?: Ref<SignaturePadHandle>;
};

// Ink on white, a little heavier than the library's default so it survives printing.
const PEN = { penColor: '#14213D', minWidth: 0.9, maxWidth: 3 } as const;

function lowerFirst(text: string): string {
  return text.charAt(0).toLowerCase() + text.slice(1);
}

/**
 * A box to sign in with a finger, stylus or mouse (signature_pad, on pointer events). It fills
 * its container's width, draws sharply at the screen's pixel ratio, and keeps the drawing when
 * the box changes size (a phone turned on its side), shrinking it rather than cutting it off.
 */
export function SignaturePad({
  label,
  labelVisuallyHidden = false,
  onChange,
  error,
  maxImageBytes,
  disabled = false,
  ref,
}: SignaturePadProps) {
  const id = useId();
  const labelId = `${id}-label`;
  const instructionsId = `${id}-instructions`;
  const errorId = `${id}-error`;
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const padRef = useRef<SignaturePadEngine | null>(null);
  // The strokes as last drawn and the size they were drawn at; a resize scales from these, so
  // shrinking and growing again does not wear the drawing down.
  const drawingRef = useRef<{ strokes: PointGroup[]; size: PadSize }>({
    strokes: [],
    size: { width: 0, height: 0 },
  });
  const onChangeRef = useRef(onChange);
  const [strokeCount, setStrokeCount] = useState(0);
  const [message, setMessage] = useState('');

  useEffect(() => {
    onChangeRef.current = onChange;
  }, [onChange]);

  const cssSize = (): PadSize => {
    const canvas = canvasRef.current;
    return canvas
      ? { width: canvas.clientWidth, height: canvas.clientHeight }
      : drawingRef.current.size;
  };

  const toDataUrl = (): string => {
    const pad = padRef.current;
    const canvas = canvasRef.current;
    if (!pad || !canvas || pad.isEmpty()) return '';
    const full = pad.toDataURL('image/png');
    if (!maxImageBytes || full.length <= maxDataUrlLength(maxImageBytes)) return full;
    // Too big at the screen's pixel ratio: the same drawing at one pixel per CSS pixel.
    const { width, height } = cssSize();
    const smaller = document.createElement('canvas');
    smaller.width = Math.max(1, Math.round(width));
    smaller.height = Math.max(1, Math.round(height));
    smaller.getContext('2d')?.drawImage(canvas, 0, 0, smaller.width, smaller.height);
    return smaller.toDataURL('image/png');
  };
  const toDataUrlRef = useRef(toDataUrl);
  useEffect(() => {
    toDataUrlRef.current = toDataUrl;
  });

  /** After a stroke, undo or clear: remember the drawing at this size and tell the form. */
  const recordDrawing = (strokes: PointGroup[]) => {
    drawingRef.current = { strokes, size: cssSize() };
    setStrokeCount(strokes.length);
    onChangeRef.current(strokes.length > 0 ? toDataUrlRef.current() : '');
  };
  const recordDrawingRef = useRef(recordDrawing);
  useEffect(() => {
    recordDrawingRef.current = recordDrawing;
  });

  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas) return;
    const pad = new SignaturePadEngine(canvas, PEN);
    padRef.current = pad;

    const fitToBox = () => {
      const size = { width: canvas.clientWidth, height: canvas.clientHeight };
      if (size.width === 0 || size.height === 0) return;
      const ratio = Math.max(window.devicePixelRatio || 1, 1);
      const pixelWidth = Math.round(size.width * ratio);
      const pixelHeight = Math.round(size.height * ratio);
      if (canvas.width === pixelWidth && canvas.height === pixelHeight) return;
      // Setting the size wipes the canvas; the strokes are drawn again, scaled to fit.
      canvas.width = pixelWidth;
      canvas.height = pixelHeight;
      canvas.getContext('2d')?.scale(ratio, ratio);
      const { strokes, size: drawnAt } = drawingRef.current;
      if (strokes.length === 0) {
        pad.clear();
        return;
      }
      pad.fromData(scaleStrokes(strokes, fitFactor(drawnAt, size)));
      onChangeRef.current(toDataUrlRef.current());
    };

    const endStroke = () => recordDrawingRef.current(pad.toData());
    pad.addEventListener('endStroke', endStroke);
    fitToBox();
    const observer = new ResizeObserver(fitToBox);
    observer.observe(canvas);
    // Zooming the page changes the pixel ratio without changing the box's CSS size.
    window.addEventListener('resize', fitToBox);
    return () => {
      observer.disconnect();
      window.removeEventListener('resize', fitToBox);
      pad.removeEventListener('endStroke', endStroke);
      pad.off();
      padRef.current = null;
    };
  }, []);

  useEffect(() => {
    const pad = padRef.current;
    if (!pad) return;
    if (disabled) pad.off();
    else pad.on();
  }, [disabled]);

  const clear = () => {
    padRef.current?.clear();
    recordDrawing([]);
  };

  useImperativeHandle(
    ref,
    () => ({
      focus: () => canvasRef.current?.focus(),
      clear,
      isEmpty: () => padRef.current?.isEmpty() ?? true,
      toDataUrl: () => toDataUrlRef.current(),
    }),
    // `clear` only reaches refs and state setters, which do not change between renders.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [],
  );

  const undo = () => {
    const pad = padRef.current;
    if (!pad) return;
    const strokes = pad.toData().slice(0, -1);
    pad.fromData(strokes);
    recordDrawing(strokes);
    if (strokes.length > 0) {
      setMessage('Last stroke undone.');
    } else {
      // The buttons turn off with nothing left to undo; the box keeps the keyboard's place.
      setMessage('Last stroke undone; the box is empty.');
      canvasRef.current?.focus();
    }
  };

  const isEmpty = strokeCount === 0;
  const nameInButtons = lowerFirst(label);

  return (
    <div role="group" aria-labelledby={labelId} className="grid gap-2">
      <p id={labelId} className={labelVisuallyHidden ? 'sr-only' : 'font-medium text-ink'}>
        {label}
      </p>
      <p id={instructionsId} className="text-sm text-ink-muted">
        Sign by drawing in the box with a finger, a stylus or the mouse, above the line.
        <span className="sr-only">
          {' '}
          Signing is done by drawing only: the box does not take typed text.
        </span>
      </p>
      <div
        className={cn(
          'relative overflow-hidden rounded-md border-2 bg-white',
          error ? 'border-alarm' : 'border-ink-muted',
          disabled && 'bg-paper-deep',
        )}
      >
        <canvas
          ref={canvasRef}
          role="img"
          tabIndex={0}
          aria-label={`${label}: ${isEmpty ? 'nothing drawn yet' : 'signature drawn'}`}
          aria-describedby={[instructionsId, error ? errorId : null].filter(Boolean).join(' ')}
          aria-invalid={error ? true : undefined}
          className="block h-48 w-full cursor-crosshair touch-none sm:h-56"
        />
        {/* The line to sign on; it lets the pen through to the canvas underneath. */}
        <div
          aria-hidden="true"
          className="pointer-events-none absolute inset-x-4 bottom-9 border-t-2 border-dashed border-ink-muted"
        />
        <p
          aria-hidden="true"
          className="pointer-events-none absolute bottom-2 left-4 text-sm font-medium text-ink-muted select-none"
        >
          Sign above
        </p>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <Button
          variant="secondary"
          size="lg"
          disabled={disabled || isEmpty}
          onClick={() => {
            clear();
            setMessage('Signature cleared; the box is empty.');
            canvasRef.current?.focus();
          }}
        >
          <Eraser aria-hidden="true" className="size-5" />
          Clear <span className="sr-only">{nameInButtons}</span>
        </Button>
        <Button variant="secondary" size="lg" disabled={disabled || isEmpty} onClick={undo}>
          <Undo2 aria-hidden="true" className="size-5" />
          Undo last stroke <span className="sr-only">of {nameInButtons}</span>
        </Button>
        <p className="flex items-center gap-1.5 text-sm font-medium">
          {isEmpty ? (
            <>
              <CircleDashed aria-hidden="true" className="size-4 shrink-0 text-info" />
              Nothing drawn yet
            </>
          ) : (
            <>
              <CircleCheck aria-hidden="true" className="size-4 shrink-0 text-normal" />
              Signature drawn
            </>
          )}
        </p>
      </div>
      <FieldErrorMessage id={errorId} message={error} />
      <LiveMessage message={message} />
    </div>
  );
}
