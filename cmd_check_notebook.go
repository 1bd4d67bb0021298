package main

import (
	"walden/analyze"
	"walden/grammar/notebook"
)

// notebookCells reads a Jupyter notebook and returns its markdown cells
// as sources, in order, so that steps in later cells can use the labels
// of earlier ones. A notebook that cannot be read gives one finding,
// placed in the .ipynb file.
func notebookCells(text []byte) ([]document, []finding) {
	nb, errs := notebook.ReadNotebook(text)
	if len(errs) > 0 {
		return nil, placeErrors(text, -1, errs, analyze.CodeUnreadable)
	}
	var docs []document
	for _, c := range nb.Cells {
		if c.Kind != "markdown" {
			continue
		}
		docs = append(docs, document{cell: c.Index, src: analyze.Source{Kind: analyze.MarkdownCell, Text: c.Text}})
	}
	return docs, nil
}
