import { useState } from 'react';

/**
 * A small modal form with one text field: Enter saves, Escape (or the button) closes without
 * saving. Used for notes and for the reason a trial is marked bad.
 */
export function TextDialog({ title, label, saveLabel, onSave, onClose }: { title: string; label: string; saveLabel: string; onSave: (text: string) => Promise<void> | void; onClose: () => void }) {
  const [text, setText] = useState('');
  const [saving, setSaving] = useState(false);
  return (
    <div className="session-dialog" role="dialog" aria-modal="true" aria-label={title} onKeyDown={(e) => e.key === 'Escape' && (e.preventDefault(), onClose())}>
      <form
        onSubmit={async (event) => {
          event.preventDefault();
          if (!text.trim()) return;
          setSaving(true);
          try {
            await onSave(text.trim());
          } finally {
            setSaving(false);
          }
        }}
      >
        <h3>{title}</h3>
        <label className="field">
          {label}
          <input autoFocus value={text} onChange={(e) => setText(e.target.value)} maxLength={2000} />
        </label>
        <div className="button-row">
          <button type="submit" disabled={saving || !text.trim()}>
            {saveLabel}
          </button>
          <button type="button" className="secondary" onClick={onClose}>
            Cancel (Esc)
          </button>
        </div>
      </form>
    </div>
  );
}
