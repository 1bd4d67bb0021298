;;; walden.el --- walden's reaction checks in Emacs, through eglot  -*- lexical-binding: t; -*-

;; Version: 0.1.0
;; Package-Requires: ((emacs "27.1") (eglot "1.9"))
;; Keywords: languages, tools

;;; Commentary:

;; walden reads the reaction steps chemists write in Markdown notebook
;; pages (fenced ```reaction blocks) and in .steps plan files, marks the
;; problems inline and shows the predicted product on hover.  This file
;; gives .steps files a small major mode, `walden-steps-mode', and tells
;; eglot to run `walden serve' for it and for Markdown buffers.
;;
;; Install: see README.md beside this file.  In short:
;;
;;   (add-to-list 'load-path "/path/to/walden/editors/emacs")
;;   (require 'walden)
;;   (add-hook 'markdown-mode-hook #'eglot-ensure)      ; optional
;;   (add-hook 'walden-steps-mode-hook #'eglot-ensure)  ; optional

;;; Code:

(require 'eglot)

(defgroup walden nil
  "Reaction checks for chemists' notebooks, by `walden serve'."
  :group 'tools
  :prefix "walden-")

(defcustom walden-program "walden"
  "The walden program: a name found on `exec-path', or a full path.
Eglot runs it as \"PROGRAM serve\".  Restart eglot after changing it."
  :type 'string
  :group 'walden)

(defvar walden-steps-mode-syntax-table
  (let ((table (make-syntax-table)))
    ;; Plan files take "//" to the end of the line as a comment.  A single
    ;; '/' stays punctuation: SMILES use it for double-bond geometry.
    (modify-syntax-entry ?/ ". 12" table)
    (modify-syntax-entry ?\n ">" table)
    ;; SMILES hold @, =, #, $, %, \ and ':' inside one word; keep them as
    ;; symbol characters so symbol motion stays inside a structure.
    (dolist (c '(?@ ?= ?# ?$ ?% ?\\ ?:))
      (modify-syntax-entry c "_" table))
    table)
  "Syntax table for `walden-steps-mode'.")

(defvar walden-steps-font-lock-keywords
  `(("^[ \t]*\\(\\[[xX -]\\]\\)[ \t]" 1 font-lock-builtin-face)
    ("^[ \t]*\\(?:\\[[xX -]\\][ \t]+\\)?\\([A-Za-z0-9_'-]+\\):[ \t]" 1 font-lock-function-name-face)
    ("@[A-Za-z0-9_'-]+" . font-lock-variable-name-face)
    (,(regexp-opt '("->" "→" "⟶")) . font-lock-keyword-face)
    ("\\(?:^\\|[ \t]\\)\\(\\+\\)\\(?:[ \t]\\|$\\)" 1 font-lock-keyword-face)
    ("\\_<-?[0-9]+\\(?:\\.[0-9]+\\)? *\\(?:°C\\|ºC\\|℃\\|degC\\|K\\|C\\|h\\|min\\|eq\\.?\\|equiv\\.?\\|mmol\\|mol ?%\\)\\_>" . font-lock-constant-face)
    ("\\_<\\(?:rt\\|r\\.t\\.\\|reflux\\|overnight\\|o/n\\)\\_>" . font-lock-constant-face))
  "Light colouring of step lines (marks, labels, references, arrows).
The server knows the exact parts of a step; this only marks what the
shape of the text shows.")

;;;###autoload
(define-derived-mode walden-steps-mode prog-mode "Steps"
  "Major mode for walden plan files (*.steps).
Every non-blank line that is not a // comment is one reaction step.
Turn on `eglot' (\\[eglot]) to get walden's warnings and hover."
  :group 'walden
  (setq-local comment-start "// ")
  (setq-local comment-start-skip "//+[ \t]*")
  (setq-local font-lock-defaults '(walden-steps-font-lock-keywords)))

;;;###autoload
(add-to-list 'auto-mode-alist '("\\.steps\\'" . walden-steps-mode))

(defun walden--server-command (&optional _interactive)
  "Return the command eglot runs: `walden-program' serve."
  (list walden-program "serve"))

;; eglot names the document language after the major mode (markdown,
;; gfm, walden-steps); walden decides how to read a file by its name
;; (.md, .steps), so all three work.
(add-to-list 'eglot-server-programs
             '((markdown-mode gfm-mode walden-steps-mode) . walden--server-command))

(provide 'walden)
;;; walden.el ends here
