import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { Dialog } from './dialog';

function renderDialog(onClose = vi.fn()) {
  render(
    <div>
      <button type="button">Behind the dialog</button>
      <Dialog title="Close alert 4" onClose={onClose}>
        <label>
          Note
          <textarea />
        </label>
        <button type="button">Close the alert</button>
        <button type="button">Cancel</button>
        <input type="hidden" name="alertId" value="a1" />
        <div hidden>
          <button type="button">Not shown</button>
        </div>
      </Dialog>
    </div>,
  );
  return onClose;
}

describe('Dialog', () => {
  it('takes the focus, keeps Tab and Shift+Tab on its own shown controls, and closes on Escape', () => {
    const onClose = renderDialog();
    const panel = screen.getByRole('dialog', { name: 'Close alert 4' });
    expect(document.activeElement).toBe(panel);
    const note = screen.getByLabelText('Note');
    const cancel = screen.getByRole('button', { name: 'Cancel' });

    fireEvent.keyDown(document, { key: 'Tab' });
    expect(document.activeElement).toBe(note);
    cancel.focus();
    fireEvent.keyDown(document, { key: 'Tab' });
    expect(document.activeElement).toBe(note);
    fireEvent.keyDown(document, { key: 'Tab', shiftKey: true });
    expect(document.activeElement).toBe(cancel);

    screen.getByRole('button', { name: 'Behind the dialog' }).focus();
    fireEvent.keyDown(document, { key: 'Tab' });
    expect(document.activeElement).toBe(note);

    fireEvent.keyDown(document, { key: 'Escape' });
    expect(onClose).toHaveBeenCalledTimes(1);
  });
});
