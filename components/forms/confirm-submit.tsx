"use client";

/**
 * A submit button that asks first: the form is sent only when the person confirms `question` (a browser dialog),
 * so one stray click cannot discard or change something that is hard to undo.
 */
export function ConfirmSubmit({ question, label, className, children, disabled }: { question: string; label?: string; className?: string; children: React.ReactNode; disabled?: boolean }) {
  return (
    <button
      type="submit"
      className={className}
      aria-label={label}
      disabled={disabled}
      onClick={(e) => {
        if (!window.confirm(question)) e.preventDefault();
      }}
    >
      {children}
    </button>
  );
}
