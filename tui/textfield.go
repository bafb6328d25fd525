package tui

import (
	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"
)

// textField is a one-line text field that opens with its value selected,
// as text fields in other programs do: the first character typed (or
// pasted) replaces the value, while an arrow key, Home, End, Backspace or
// Delete first keeps it and edits it. The selection shows in the selection
// style, and Selected tells the App so that the status line can say so.
type textField struct {
	styles   *Styles
	input    textinput.Model
	selected bool // the whole value is selected: typing replaces it
}

func newTextField(styles *Styles, limit int) textField {
	ti := textinput.New()
	ti.Prompt = "> "
	ti.Cursor.SetMode(cursor.CursorStatic) // no blinking: fewer redraws over SSH
	ti.CharLimit = limit
	return textField{styles: styles, input: ti}
}

// Start opens the field with value, selected.
func (f *textField) Start(value string) {
	f.input.SetValue(value)
	f.input.CursorEnd()
	f.input.Focus()
	f.selected = value != ""
}

// Stop closes the field.
func (f *textField) Stop() {
	f.input.Blur()
	f.selected = false
}

// Value returns the text in the field.
func (f *textField) Value() string { return f.input.Value() }

// Selected reports whether the value is still selected (untouched).
func (f *textField) Selected() bool { return f.selected }

// Update handles a key: with the value selected, typed or pasted text
// replaces it; any other key drops the selection and edits the value.
func (f textField) Update(k tea.KeyMsg) (textField, tea.Cmd) {
	if f.selected {
		f.selected = false
		if k.Type == tea.KeyRunes || k.Type == tea.KeySpace {
			f.input.SetValue("")
		}
	}
	var cmd tea.Cmd
	f.input, cmd = f.input.Update(k)
	return f, cmd
}

// View draws the field: the prompt and the value shown as selected while
// it is, else the text input with its cursor. The selection is drawn in
// inverted colours; without colour (NO_COLOR, where no terminal
// attribute is written) it is bracketed, "[300]", so that it still shows.
func (f textField) View() string {
	if f.selected {
		v := f.styles.T(f.input.Value())
		if !f.styles.Color {
			return f.input.Prompt + "[" + v + "]"
		}
		return f.input.Prompt + f.styles.Selected.Reverse(true).Render(v)
	}
	return f.input.View()
}
