package server

import (
	"encoding/json"
	"reflect"
	"testing"

	"go.lsp.dev/protocol"
)

// The hand-written encoder says the same as encoding/json.
func TestAppendPublishDiagnostics(t *testing.T) {
	v := int32(7)
	p := &publishDiagnosticsParams{URI: "file:///lab/Désirée's page.md", Version: &v, Diagnostics: []protocol.Diagnostic{
		{Range: protocol.Range{Start: protocol.Position{Line: 1, Character: 2}, End: protocol.Position{Line: 1, Character: 9}},
			Severity: protocol.DiagnosticSeverityWarning, Code: "base-eliminates", Source: "walden",
			Message: "the \"bulky\" base\teliminates at 25 °C → alkene \\ 🧪 \x01 \xff",
			Tags:    []protocol.DiagnosticTag{protocol.DiagnosticTagUnnecessary},
			RelatedInformation: []protocol.DiagnosticRelatedInformation{{
				Location: protocol.Location{URI: "file:///lab/p.md", Range: protocol.Range{End: protocol.Position{Line: 3, Character: 4}}},
				Message:  "KOtBu\n"}}},
		{Message: "", Severity: protocol.DiagnosticSeverityError},
	}}
	for _, tc := range []*publishDiagnosticsParams{p, {URI: "x", Diagnostics: []protocol.Diagnostic{}}} {
		got := appendPublishDiagnostics(nil, tc)
		if !json.Valid(got) {
			t.Fatalf("not JSON: %s", got)
		}
		want, _ := json.Marshal(tc)
		var a, b any
		_ = json.Unmarshal(got, &a)
		_ = json.Unmarshal(want, &b)
		if !reflect.DeepEqual(a, b) {
			t.Errorf("hand-written encoder:\n%s\nencoding/json:\n%s", got, want)
		}
	}
	if plain(&publishDiagnosticsParams{Diagnostics: []protocol.Diagnostic{{Code: 42}}}) {
		t.Error("a numeric code was taken as plain")
	}
}
