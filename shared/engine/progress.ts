// The progress and cancellation contract every long engine function follows: report a fraction in [0, 1] with a
// short phase label, and poll shouldStop() every few thousand steps (throwing CancelledError when it answers true).
export type Progress = (fraction: number, phase: string) => void;
export type ShouldStop = () => boolean;
