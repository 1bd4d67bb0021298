package main

import (
	"encoding/json"
	"fmt"
	"io"
	"path/filepath"
	"sort"

	"walden/analyze"
)

// SARIF 2.1.0 output (OASIS Static Analysis Results Interchange Format,
// https://docs.oasis-open.org/sarif/sarif/v2.1.0/), for code-scanning
// services. Only the fields walden fills are declared.

type sarifLog struct {
	Schema  string     `json:"$schema"`
	Version string     `json:"version"`
	Runs    []sarifRun `json:"runs"`
}

type sarifRun struct {
	Tool       sarifTool     `json:"tool"`
	ColumnKind string        `json:"columnKind"`
	Results    []sarifResult `json:"results"`
}

type sarifTool struct {
	Driver sarifDriver `json:"driver"`
}

type sarifDriver struct {
	Name           string      `json:"name"`
	Version        string      `json:"version"`
	InformationURI string      `json:"informationUri,omitempty"`
	Rules          []sarifRule `json:"rules"`
}

type sarifRule struct {
	ID                   string       `json:"id"`
	ShortDescription     sarifMessage `json:"shortDescription"`
	DefaultConfiguration struct {
		Level string `json:"level"`
	} `json:"defaultConfiguration"`
}

type sarifMessage struct {
	Text string `json:"text"`
}

type sarifResult struct {
	RuleID    string          `json:"ruleId"`
	RuleIndex int             `json:"ruleIndex"`
	Level     string          `json:"level"`
	Message   sarifMessage    `json:"message"`
	Locations []sarifLocation `json:"locations"`
}

type sarifLocation struct {
	PhysicalLocation sarifPhysical  `json:"physicalLocation"`
	LogicalLocations []sarifLogical `json:"logicalLocations,omitempty"`
}

type sarifPhysical struct {
	ArtifactLocation sarifArtifact `json:"artifactLocation"`
	Region           sarifRegion   `json:"region"`
}

type sarifArtifact struct {
	URI string `json:"uri"`
}

// sarifRegion is 1-based, columns in UTF-16 code units (the run's
// columnKind).
type sarifRegion struct {
	StartLine   int `json:"startLine"`
	StartColumn int `json:"startColumn"`
	EndLine     int `json:"endLine"`
	EndColumn   int `json:"endColumn"`
}

type sarifLogical struct {
	Name string `json:"name"`
	Kind string `json:"kind"`
}

// sarifLevel maps a severity to SARIF's levels.
func sarifLevel(s analyze.Severity) string {
	switch s {
	case analyze.Error:
		return "error"
	case analyze.Warning:
		return "warning"
	}
	return "note"
}

// writeSARIF prints one SARIF log with one run. Positions in notebook
// cells are given within the cell, with the cell named as a logical
// location, since a cell's lines are not lines of the .ipynb file.
func writeSARIF(w io.Writer, files []checkedFile) error {
	used := map[string]analyze.Severity{}
	for _, cf := range files {
		for _, f := range cf.findings {
			used[f.diag.Code] = f.diag.Severity
		}
	}
	var ids []string
	for id := range used {
		ids = append(ids, id)
	}
	sort.Strings(ids)
	index := map[string]int{}
	rules := make([]sarifRule, len(ids))
	for i, id := range ids {
		index[id] = i
		rules[i].ID = id
		rules[i].ShortDescription.Text = analyze.CodeTitle(id)
		if rules[i].ShortDescription.Text == "" {
			rules[i].ShortDescription.Text = id
		}
		rules[i].DefaultConfiguration.Level = sarifLevel(used[id])
	}
	run := sarifRun{
		Tool:       sarifTool{sarifDriver{Name: "walden", Version: version, Rules: rules}},
		ColumnKind: "utf16CodeUnits",
		Results:    []sarifResult{},
	}
	for _, cf := range files {
		for _, f := range cf.findings {
			uri := filepath.ToSlash(f.path(cf.path))
			loc := sarifLocation{PhysicalLocation: sarifPhysical{
				ArtifactLocation: sarifArtifact{URI: uri},
				Region:           sarifRegion{f.line + 1, f.char + 1, f.endLine + 1, f.endChar + 1},
			}}
			if f.cell >= 0 {
				loc.LogicalLocations = []sarifLogical{{Name: fmt.Sprintf("cell %d", f.cell+1), Kind: "module"}}
			}
			run.Results = append(run.Results, sarifResult{
				RuleID:    f.diag.Code,
				RuleIndex: index[f.diag.Code],
				Level:     sarifLevel(f.diag.Severity),
				Message:   sarifMessage{f.diag.Message},
				Locations: []sarifLocation{loc},
			})
		}
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(sarifLog{
		Schema:  "https://json.schemastore.org/sarif-2.1.0.json",
		Version: "2.1.0",
		Runs:    []sarifRun{run},
	})
}
