package notebook

import (
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// notebookSeeds are notebooks of the shapes Jupyter writes and of the
// corners of JSON (RFC 8259): escapes, surrogate pairs, numbers, nesting,
// spaces, duplicate keys, and texts that are no notebook.
var notebookSeeds = []string{
	`{"nbformat":4,"cells":[{"cell_type":"markdown","source":["` + "```reaction\\n" + `","A + B\n","` + "```" + `"]}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"markdown","source":"x"},{"cell_type":"code","source":[],"outputs":[{}]}]}`,
	`{"nbformat":3}`, `{"nbformat":4,"cells":[`, `[]`, ``, `{"cells":[],"nbformat":4,"x":{"y":[1,2,{"z":null}]}}`,
	` { "nbformat" : 4.0 , "nbformat_minor" : 5 , "metadata" : { "kernelspec" : { "name" : "python3" } } ,` + "\n\t\r" + ` "cells" : [ ] } `,
	`{"nbformat":4,"cells":[{"source":"a\"b\\c\/d\b\f\n\r\t\u00e9\u2192\ud83e\uddea","cell_type":"markdown"}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"markdown","source":"\ud83e"}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"markdown","source":"\udc00x"}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"markdown","source":"bad \xff byte"}]}`,
	`{"nbformat":4,"cells":[{"cell_type":null,"source":[null]}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"raw","source":"x","cell_type":"markdown","source":"y"}],"cells":[{"source":""}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"code","source":"x","outputs":[{"data":{"image/png":"iVBOR"},"n":-0.5e+3,"t":true,"f":false}]}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"code","source":"x","outputs":[01]}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"code","source":"x",}]}`,
	`{"nbformat":4,"cells":[{"cell_type":"code"}]}`,
	`{"nbformat":"4","cells":[]}`, `{"nbformat":4,"cells":[]}]`, `{"nbformat":4,"cells":[]} x`, "\ufeff{\"nbformat\":4,\"cells\":[]}",
	`{"nbformat":1e999,"cells":[]}`, `{"nbformat":4,"cells":[],"m":"` + "\x01" + `"}`, `{"nbf\u006frmat":4,"c\u0065lls":[{"cell_type":"markdown","source":"x"}]}`,
}

// TestReadFast: on the repository's notebooks and the seeds, the one-pass
// reader agrees with the encoding/json reader wherever it reads at all,
// and reads the well-formed ones.
func TestReadFast(t *testing.T) {
	files, err := filepath.Glob("../testdata/*.ipynb")
	require.NoError(t, err)
	var inputs [][]byte
	for _, f := range files {
		data, err := os.ReadFile(f)
		require.NoError(t, err)
		inputs = append(inputs, data)
	}
	for _, s := range notebookSeeds {
		inputs = append(inputs, []byte(s))
	}
	read := 0
	for _, data := range inputs {
		if compareFast(t, data) {
			read++
		}
	}
	// The well-formed nbformat 4 notebooks among them: kestrel.ipynb and
	// seven seeds (the first two, the nested metadata, the spaces, the
	// escapes, the outputs, the escaped keys); a cell with two sources is
	// left to encoding/json.
	assert.Equal(t, 8, read)
}

// FuzzNotebookFast compares the one-pass reader with the encoding/json
// reader on any bytes.
func FuzzNotebookFast(f *testing.F) {
	for _, s := range notebookSeeds {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) { compareFast(t, data) })
}

// compareFast checks that when readFast reads data, readChecked reads
// the same notebook without error; it reports whether readFast read it.
func compareFast(t *testing.T, data []byte) bool {
	t.Helper()
	fast, ok := readFast(data)
	if !ok {
		return false
	}
	want, errs := readChecked(data)
	require.Empty(t, errs, "readFast read a notebook readChecked refuses: %q", data)
	require.Len(t, fast.Cells, len(want.Cells), "%q", data)
	for i, c := range fast.Cells {
		w := want.Cells[i]
		assert.Equal(t, w.Index, c.Index)
		assert.Equal(t, w.Kind, c.Kind, "%q", data)
		assert.Equal(t, w.Text, c.Text, "%q", data)
		assert.Equal(t, w.JSON, c.JSON, "%q", data)
		assert.Equal(t, w.Page, c.Page, "%q", data)
	}
	return true
}
