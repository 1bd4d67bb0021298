;;; e2e.el --- drive Emacs and eglot through walden.el, for e2e_emacs_test.go  -*- lexical-binding: t; -*-

;;; Commentary:

;; Run as:
;;   emacs --batch -q -l editors/emacs/test/e2e.el
;; (-q, not -Q: Debian loads its elpa-* packages from site-start)
;; with the environment:
;;   WALDEN_E2E_EMACS_DIR  the editors/emacs folder (put on `load-path')
;;   WALDEN_E2E_CMD        the walden program
;;   WALDEN_E2E_PLAN       a JSON file: {"timeout_ms": N, "files": [{"path": "...",
;;                           "hovers": [{"line": L, "character": C}]}]}
;;   WALDEN_E2E_OUT        where to write what Emacs saw, as JSON
;;
;; It loads the set-up chemists install (walden.el), opens each file,
;; starts eglot, waits for diagnostics, asks for hovers and shuts the
;; server down.  Every wait is bounded and Emacs always exits: 0 when the
;; script finished, 1 after an error (also written to the JSON).

;;; Code:

(require 'json)
(require 'cl-lib)
(require 'package)
;; Debian's elpa-* packages and ~/.emacs.d/elpa both become loadable.
(package-initialize)

(defvar walden-e2e--published nil
  "Every publishDiagnostics received, newest first, as (URI . DIAGNOSTICS).")

(defun walden-e2e--getenv (name)
  "Return environment variable NAME, or signal an error."
  (or (getenv name) (error "%s is not set" name)))

(defun walden-e2e--wait (timeout-ms predicate)
  "Process output until PREDICATE is true or TIMEOUT-MS passes; return its value."
  (let ((deadline (+ (float-time) (/ timeout-ms 1000.0)))
        (value nil))
    (while (and (not (setq value (funcall predicate)))
                (< (float-time) deadline))
      (accept-process-output nil 0.05))
    value))

(defun walden-e2e--diagnostic (d)
  "Turn an LSP diagnostic plist D into an alist for JSON."
  (let ((start (plist-get (plist-get d :range) :start))
        (end (plist-get (plist-get d :range) :end)))
    `((line . ,(plist-get start :line))
      (character . ,(plist-get start :character))
      (end_line . ,(plist-get end :line))
      (end_character . ,(plist-get end :character))
      (severity . ,(plist-get d :severity))
      (code . ,(plist-get d :code))
      (message . ,(plist-get d :message)))))

(defun walden-e2e--hover (line character)
  "Ask the server for the hover at LINE and CHARACTER of the current buffer."
  (save-excursion
    (goto-char (point-min))
    (forward-line line)
    (forward-char character)
    (condition-case err
        (let* ((reply (jsonrpc-request (eglot-current-server) :textDocument/hover
                                       (eglot--TextDocumentPositionParams)))
               (contents (plist-get reply :contents)))
          `((line . ,line) (character . ,character)
            (value . ,(if (stringp contents) contents (plist-get contents :value)))))
      (error `((line . ,line) (character . ,character)
               (error . ,(error-message-string err)))))))

(defun walden-e2e--file (spec timeout)
  "Open the file of SPEC, start eglot, and return what Emacs saw."
  (let* ((path (alist-get 'path spec))
         ;; find-file, not find-file-noselect: Flymake starts only in a
         ;; buffer that a window shows.
         (buffer (find-file path)))
    (with-current-buffer buffer
      ;; eglot-ensure waits for the command loop, which batch mode lacks,
      ;; so start eglot directly with the contact walden.el registered.
      (apply #'eglot (eglot--guess-contact))
      (let* ((uri-suffix (file-name-nondirectory path))
             (published
              (walden-e2e--wait
               timeout
               (lambda ()
                 (cl-find-if (lambda (p) (string-suffix-p uri-suffix (car p)))
                             walden-e2e--published))))
             (shown (walden-e2e--wait timeout (lambda () (flymake-diagnostics)))))
        `((path . ,path)
          (mode . ,(symbol-name major-mode))
          (published . ,(if published
                            (vconcat (mapcar #'walden-e2e--diagnostic (cdr published)))
                          nil))
          (flymake_count . ,(length shown))
          (hovers . ,(vconcat
                      (mapcar (lambda (h)
                                (walden-e2e--hover (alist-get 'line h) (alist-get 'character h)))
                              (alist-get 'hovers spec)))))))))

(defun walden-e2e--main ()
  "Run the plan and return the results as an alist."
  (add-to-list 'load-path (walden-e2e--getenv "WALDEN_E2E_EMACS_DIR"))
  (require 'markdown-mode nil t)
  (require 'walden)
  (setq walden-program (walden-e2e--getenv "WALDEN_E2E_CMD"))
  (setq eglot-sync-connect 15)
  (cl-defmethod eglot-handle-notification :before
    (_server (_method (eql textDocument/publishDiagnostics)) &key uri diagnostics &allow-other-keys)
    (push (cons uri (append diagnostics nil)) walden-e2e--published))
  (let* ((json-object-type 'alist)
         (json-array-type 'list)
         (plan (json-read-file (walden-e2e--getenv "WALDEN_E2E_PLAN")))
         (timeout (or (alist-get 'timeout_ms plan) 10000))
         (files (mapcar (lambda (spec) (walden-e2e--file spec timeout))
                        (alist-get 'files plan))))
    (dolist (server (hash-table-values eglot--servers-by-project))
      (dolist (s server)
        (ignore-errors (eglot-shutdown s))))
    `((emacs . ,emacs-version)
      (files . ,(vconcat files)))))

(let* ((out (getenv "WALDEN_E2E_OUT"))
       (result (condition-case err
                   (walden-e2e--main)
                 (error `((error . ,(error-message-string err)))))))
  (with-temp-file out
    (insert (json-encode result)))
  (kill-emacs (if (alist-get 'error result) 1 0)))

;;; e2e.el ends here
