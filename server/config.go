package server

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"net/url"
	"os"
	"path/filepath"
	"strings"

	"go.lsp.dev/protocol"

	"walden/analyze"
	"walden/grammar/source"
)

// Configuration comes from two places, merged field by field:
//
//  1. the project's settings file (analyze.SettingsFile, found by walking
//     up from the workspace root, read by analyze.LoadSettings), which a
//     lab keeps with its notebooks;
//  2. the editor's settings, sent in initializationOptions and
//     workspace/didChangeConfiguration, which win where they are set
//     (disabled codes are added to the file's).
//
// A change to either makes a new Engine and re-analyses every open
// document. The settings file is re-read when it is saved in the editor.

func init() {
	notifications["workspace/didChangeConfiguration"] = notification((*Server).didChangeConfiguration)
}

// settings is the session's configuration state.
type settings struct {
	root   string         // workspace root folder, where the settings file search starts
	editor editorSettings // the editor's own settings
	file   string         // the settings file in use, "" when none was found
}

// editorSettings is what an editor may send, under a "walden" key or as
// the object itself:
//
//	{"walden": {"names": "lab-names.txt", "disable": ["solvent-assumed"],
//	            "solvent": "DMF", "temperature": 25}}
type editorSettings struct {
	Names       string   `json:"names,omitempty"`       // the lab's names file (absolute, or relative to the workspace root)
	Disable     []string `json:"disable,omitempty"`     // diagnostic codes not to report
	Solvent     string   `json:"solvent,omitempty"`     // assumed when a step names none
	Temperature *float64 `json:"temperature,omitempty"` // °C, assumed when a step gives none
}

type didChangeConfigurationParams struct {
	Settings json.RawMessage `json:"settings"`
}

func (s *Server) didChangeConfiguration(ctx context.Context, p *didChangeConfigurationParams) error {
	if len(p.Settings) == 0 || string(p.Settings) == "null" {
		s.reconfigure() // a client that pulls settings sends none; the file may have changed
		return nil
	}
	return s.configure(p.Settings)
}

// configure reads editor settings and applies them.
func (s *Server) configure(raw json.RawMessage) error {
	var wrapped struct {
		Walden *json.RawMessage `json:"walden"`
	}
	if err := json.Unmarshal(raw, &wrapped); err == nil && wrapped.Walden != nil {
		raw = *wrapped.Walden
	}
	var es editorSettings
	dec := json.NewDecoder(bytes.NewReader(raw))
	if err := dec.Decode(&es); err != nil {
		s.reconfigure()
		return fmt.Errorf("settings not understood (expected names, disable, solvent, temperature): %w", err)
	}
	s.mu.Lock()
	s.settings.editor = es
	s.mu.Unlock()
	s.reconfigure()
	return nil
}

// reconfigure reads the settings file, merges the editor's settings, and
// re-analyses everything with a new Engine.
func (s *Server) reconfigure() {
	s.mu.Lock()
	root, es := s.settings.root, s.settings.editor
	s.mu.Unlock()

	var cfg analyze.Config
	var file string
	if root != "" {
		var errs source.ErrorList
		cfg, file, errs = analyze.LoadSettings(root, s.readFile)
		if len(errs) > 0 {
			text, _ := s.readFile(file)
			m := source.NewMapper(text)
			var b strings.Builder
			for _, e := range errs {
				fmt.Fprintf(&b, "\n%s:%s: %s", file, m.Point(e.Span.Start), e.Msg)
			}
			s.tell(protocol.MessageTypeWarning, "the settings file has errors; the rest of it is used:"+b.String())
		}
	}
	if es.Names != "" {
		p := es.Names
		if !filepath.IsAbs(p) && root != "" {
			p = filepath.Join(root, p)
		}
		names, err := s.readFile(p)
		if err != nil {
			s.tell(protocol.MessageTypeWarning, fmt.Sprintf("cannot read the names file given in the editor settings: %v", err))
		} else {
			cfg.LabNames, cfg.LabNamesFile = names, p
		}
	}
	cfg.Disabled = append(cfg.Disabled, es.Disable...)
	if es.Solvent != "" {
		cfg.DefaultSolvent = es.Solvent
	}
	if es.Temperature != nil {
		t := *es.Temperature
		cfg.DefaultTempC = &t
	}

	s.mu.Lock()
	defer s.mu.Unlock()
	s.settings.file = file
	s.engine = analyze.NewEngine(cfg)
	if s.phase == running {
		s.reanalyseAll()
	}
}

// readFile reads a file, preferring the editor's unsaved text when the
// file is open.
func (s *Server) readFile(path string) ([]byte, error) {
	s.mu.Lock()
	for uri, d := range s.texts {
		if filePath(uri) == path {
			s.mu.Unlock()
			return d.text(), nil
		}
	}
	s.mu.Unlock()
	if s.opts.ReadFile != nil {
		return s.opts.ReadFile(path)
	}
	return os.ReadFile(path)
}

// isSettingsFile reports whether uri names a settings file, whose saving
// makes the server re-read its configuration.
func isSettingsFile(uri protocol.DocumentURI) bool {
	p := filePath(uri)
	return p != "" && filepath.Base(p) == analyze.SettingsFile
}

// filePath returns the local path of a file: URI, or "" for any other.
func filePath(uri protocol.DocumentURI) string {
	u, err := url.Parse(string(uri))
	if err != nil || u.Scheme != "file" {
		return ""
	}
	p := u.Path
	if len(p) >= 3 && p[0] == '/' && p[2] == ':' { // /C:/… on Windows
		p = p[1:]
	}
	return filepath.FromSlash(p)
}
