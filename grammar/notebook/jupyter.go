package notebook

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"strings"

	"walden/grammar/source"
)

// MaxNotebookSize is the largest .ipynb file ReadNotebook reads, in
// bytes. Notebooks with embedded images can be large; 64 MiB covers them
// and bounds the work on a wrong file.
const MaxNotebookSize = 64 << 20

// Notebook is a Jupyter notebook as walden reads it: its cells in order.
type Notebook struct {
	Cells []*Cell
}

// Cell is one notebook cell. Its Text is a host text of its own: the
// positions in Page are byte offsets into Text, and the editor addresses
// the cell as a separate text document (LSP notebook cells).
type Cell struct {
	Index int         // 0-based position in the notebook
	Kind  string      // "markdown", "code" or "raw" (cell_type)
	Text  []byte      // the cell's source, joined when stored as a list of strings
	JSON  source.Span // where the cell object sits in the .ipynb file
	Page  *Page       // the step lines found; nil for cells that are not markdown
}

// Mapper returns a new Mapper of the cell's Text, which converts offsets
// to the cell's own LSP lines and UTF-16 characters, as an editor
// addresses a notebook cell. It is made when asked for: most readers of
// a notebook need it for none of its cells, or for a few.
func (c *Cell) Mapper() *source.Mapper { return source.NewMapper(c.Text) }

// Where returns a readable location for p in the cell, with 1-based
// cell, line and column numbers (columns count characters), as in
// "cell 3, line 2, column 5".
func (c *Cell) Where(p source.Pos) string {
	pt := c.Mapper().Point(p)
	return fmt.Sprintf("cell %d, line %d, column %d", c.Index+1, pt.Line, pt.Column)
}

// ReadNotebook reads a Jupyter notebook in nbformat 4 and finds the step
// lines of its markdown cells. A notebook that cannot be read (not JSON,
// another nbformat, a cell of the wrong shape) gives exactly one error,
// positioned in the .ipynb file's bytes, and no cells.
func ReadNotebook(data []byte) (*Notebook, source.ErrorList) {
	var errs source.ErrorList
	if len(data) > MaxNotebookSize {
		errs.Add(span(0, 0), "notebook-too-large", fmt.Sprintf(
			"notebook is %d bytes; walden reads notebooks up to %d bytes: clear the cell outputs and try again", len(data), MaxNotebookSize))
		return &Notebook{}, errs
	}
	if nb, ok := readFast(data); ok {
		return nb, nil
	}
	return readChecked(data)
}

// readChecked reads a notebook with encoding/json, token by token, and
// words the error of a notebook it cannot read.
func readChecked(data []byte) (*Notebook, source.ErrorList) {
	r := &nbReader{data: data, dec: json.NewDecoder(bytes.NewReader(data))}
	nb, err := r.notebook()
	if err != nil {
		var e *source.Error
		if !errors.As(err, &e) {
			e = r.wrap(err)
		}
		return &Notebook{}, source.ErrorList{e}
	}
	return nb, nil
}

// nbReader walks the notebook JSON token by token, so that every error
// knows its offset and large outputs are skipped without being kept.
type nbReader struct {
	data []byte
	dec  *json.Decoder
}

// wrap turns a JSON decoding error into a positioned error.
func (r *nbReader) wrap(err error) *source.Error {
	off := int(r.dec.InputOffset())
	var syn *json.SyntaxError
	var typ *json.UnmarshalTypeError
	switch {
	case errors.As(err, &syn):
		off = int(syn.Offset) - 1
	case errors.As(err, &typ):
		off = int(typ.Offset) - 1
	case errors.Is(err, io.EOF) || errors.Is(err, io.ErrUnexpectedEOF):
		off = len(r.data)
		err = errors.New("unexpected end of file")
	}
	off = min(max(off, 0), len(r.data))
	return &source.Error{Span: span(off, min(off+1, len(r.data))), Code: "notebook-json",
		Msg: fmt.Sprintf("notebook is not valid JSON: %v; repair the file or save it again from Jupyter", err)}
}

// errorAt returns a positioned error at offset off.
func (r *nbReader) errorAt(off int, code, format string, args ...any) *source.Error {
	off = min(max(off, 0), len(r.data))
	return &source.Error{Span: span(off, min(off+1, len(r.data))), Code: code, Msg: fmt.Sprintf(format, args...)}
}

// offset returns the offset of the next token (after spaces and the
// separators ',' and ':', which the decoder consumes with the token).
func (r *nbReader) offset() int {
	off := int(r.dec.InputOffset())
	for off < len(r.data) && strings.IndexByte(" \t\r\n,:", r.data[off]) >= 0 {
		off++
	}
	return off
}

// delim reads the delimiter want.
func (r *nbReader) delim(want json.Delim, what string) error {
	off := r.offset()
	t, err := r.dec.Token()
	if err != nil {
		return err
	}
	if d, ok := t.(json.Delim); !ok || d != want {
		return r.errorAt(off, "notebook-shape", "expected %s ('%c'), found %s; this is not a Jupyter notebook", what, want, describe(t))
	}
	return nil
}

// key reads an object key, or reports the end of the object.
func (r *nbReader) key() (string, bool, error) {
	if !r.dec.More() {
		_, err := r.dec.Token() // '}'
		return "", false, err
	}
	t, err := r.dec.Token()
	if err != nil {
		return "", false, err
	}
	k, _ := t.(string)
	return k, true, nil
}

// skip reads and drops one value.
func (r *nbReader) skip() error {
	var v json.RawMessage
	return r.dec.Decode(&v)
}

func (r *nbReader) notebook() (*Notebook, error) {
	if err := r.delim('{', "a JSON object"); err != nil {
		return nil, err
	}
	nb := &Notebook{}
	format, formatAt, sawCells := 0, 0, false
	for {
		k, ok, err := r.key()
		if err != nil {
			return nil, err
		}
		if !ok {
			break
		}
		switch k {
		case "nbformat":
			formatAt = r.offset()
			var v any
			if err := r.dec.Decode(&v); err != nil {
				return nil, err
			}
			n, ok := v.(float64)
			if !ok || n != float64(int(n)) || n < 1 {
				return nil, r.errorAt(formatAt, "notebook-format", "nbformat must be a whole number such as 4, found %s", string(r.data[formatAt:r.dec.InputOffset()]))
			}
			format = int(n)
		case "cells":
			sawCells = true
			if err := r.cells(nb); err != nil {
				return nil, err
			}
		default:
			if err := r.skip(); err != nil {
				return nil, err
			}
		}
	}
	if r.dec.More() {
		return nil, r.errorAt(r.offset(), "notebook-json", "text after the end of the notebook's JSON object; delete it")
	}
	switch {
	case format == 0:
		return nil, r.errorAt(0, "notebook-format", "no \"nbformat\" field: this is not a Jupyter notebook")
	case format != 4:
		return nil, r.errorAt(formatAt, "notebook-format",
			"notebook is nbformat %d; walden reads nbformat 4: convert it with 'jupyter nbconvert --to notebook' first", format)
	case !sawCells:
		return nil, r.errorAt(0, "notebook-shape", "no \"cells\" list: this is not an nbformat 4 notebook")
	}
	return nb, nil
}

func (r *nbReader) cells(nb *Notebook) error {
	if err := r.delim('[', "the list of cells"); err != nil {
		return err
	}
	for r.dec.More() {
		c := &Cell{Index: len(nb.Cells)}
		start := r.offset()
		if err := r.delim('{', fmt.Sprintf("cell %d as an object", c.Index+1)); err != nil {
			return err
		}
		sawSource := false
		for {
			k, ok, err := r.key()
			if err != nil {
				return err
			}
			if !ok {
				break
			}
			switch k {
			case "cell_type":
				at := r.offset()
				if err := r.dec.Decode(&c.Kind); err != nil {
					return r.errorAt(at, "notebook-shape", "cell %d: cell_type must be a string", c.Index+1)
				}
			case "source":
				sawSource = true
				at := r.offset()
				var raw json.RawMessage
				if err := r.dec.Decode(&raw); err != nil {
					return err
				}
				text, ok := cellSource(raw)
				if !ok {
					return r.errorAt(at, "notebook-shape", "cell %d: source must be a string or a list of strings", c.Index+1)
				}
				c.Text = text
			default:
				if err := r.skip(); err != nil {
					return err
				}
			}
		}
		c.JSON = span(start, int(r.dec.InputOffset()))
		if !sawSource {
			return r.errorAt(start, "notebook-shape", "cell %d has no \"source\"", c.Index+1)
		}
		if c.Kind == "markdown" {
			c.Page = FindMarkdown(c.Text)
		}
		nb.Cells = append(nb.Cells, c)
	}
	_, err := r.dec.Token() // ']'
	return err
}

// cellSource decodes a cell's source: one string, or a list of strings to
// be joined (nbformat 4 allows both).
func cellSource(raw json.RawMessage) ([]byte, bool) {
	raw = bytes.TrimSpace(raw)
	if len(raw) == 0 {
		return nil, false
	}
	switch raw[0] {
	case '"':
		var s string
		if json.Unmarshal(raw, &s) != nil {
			return nil, false
		}
		return []byte(s), true
	case '[':
		var parts []string
		if json.Unmarshal(raw, &parts) != nil {
			return nil, false
		}
		return []byte(strings.Join(parts, "")), true
	}
	return nil, false
}

// describe names a JSON token for a message.
func describe(t json.Token) string {
	switch v := t.(type) {
	case json.Delim:
		return fmt.Sprintf("'%c'", v)
	case string:
		return "a string"
	case nil:
		return "null"
	case bool:
		return "a boolean"
	}
	return "a number"
}
