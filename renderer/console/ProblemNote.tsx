/** What stops the operator's form from going ahead, in one line (nothing when all is well). */
export function ProblemNote({ problem }: { problem: string | null | undefined }) {
  if (!problem) return null;
  return (
    <p className="failure" role="alert">
      {problem}
    </p>
  );
}
