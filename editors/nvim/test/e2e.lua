-- e2e.lua drives a headless Neovim through the walden set-up that chemists
-- install (editors/nvim/lua/walden.lua) and writes what the editor saw as
-- JSON, for e2e_nvim_test.go at the repository root to check.
--
-- Run as:
--   nvim --headless -u NONE -i NONE -n -c 'luafile editors/nvim/test/e2e.lua'
-- with the environment:
--   WALDEN_E2E_NVIM_DIR  the editors/nvim folder (put on 'runtimepath')
--   WALDEN_E2E_CMD       the walden program to run as `walden serve`
--   WALDEN_E2E_PLAN      a JSON file: { "timeout_ms": N, "files": [ {
--                          "path": "...", "hovers": [ {"line": L, "character": C} ],
--                          "edit": {"line": L, "text": "..."} or absent } ] }
--   WALDEN_E2E_OUT       where to write the results
--
-- It only uses what Neovim 0.7.2 (Debian 12) offers. Every wait is bounded,
-- and the script always quits: `qall!` when it finished, `cquit` after an
-- error (the error is in the JSON too).

local out_path = assert(os.getenv('WALDEN_E2E_OUT'), 'WALDEN_E2E_OUT is not set')
local results = { files = {}, published = {} }

local function write_results()
  local f = assert(io.open(out_path, 'w'))
  f:write(vim.fn.json_encode(results))
  f:close()
end

local function read_json(path)
  local f = assert(io.open(path, 'r'))
  local text = f:read('*a')
  f:close()
  return vim.fn.json_decode(text)
end

-- or_null keeps an absent LSP result visible in the JSON as null.
local function or_null(v)
  if v == nil then
    return vim.NIL
  end
  return v
end

local function main()
  local plan = read_json(assert(os.getenv('WALDEN_E2E_PLAN'), 'WALDEN_E2E_PLAN is not set'))
  local timeout = plan.timeout_ms or 10000
  local v = vim.version()
  results.nvim = string.format('%d.%d.%d', v.major, v.minor, v.patch)
  results.lsp_log = vim.lsp.get_log_path()

  -- Record every publishDiagnostics as it arrives, then let Neovim's own
  -- handler put it into vim.diagnostic, as it would for a chemist.
  local publish = vim.lsp.handlers['textDocument/publishDiagnostics']
  vim.lsp.handlers['textDocument/publishDiagnostics'] = function(err, params, ctx, config)
    table.insert(results.published, {
      uri = params.uri,
      version = or_null(params.version),
      diagnostics = params.diagnostics,
      at_ms = vim.loop.now(),
    })
    return publish(err, params, ctx, config)
  end

  vim.cmd('filetype on')
  vim.opt.runtimepath:prepend(assert(os.getenv('WALDEN_E2E_NVIM_DIR'), 'WALDEN_E2E_NVIM_DIR is not set'))
  local exited = nil
  require('walden').setup({
    cmd = { assert(os.getenv('WALDEN_E2E_CMD'), 'WALDEN_E2E_CMD is not set'), 'serve' },
    on_init = function(_, result)
      results.initialize = result
    end,
    on_exit = function(code, signal)
      exited = { code = code, signal = signal }
    end,
  })

  -- latest returns the newest publication for uri at or after version.
  local function latest(uri, version)
    for i = #results.published, 1, -1 do
      local p = results.published[i]
      if p.uri == uri and (p.version == vim.NIL or p.version >= version) then
        return p
      end
    end
    return nil
  end

  local client_id
  for _, file in ipairs(plan.files) do
    vim.cmd('edit ' .. vim.fn.fnameescape(file.path))
    local bufnr = vim.api.nvim_get_current_buf()
    local uri = vim.uri_from_bufnr(bufnr)
    local seen = { path = file.path, uri = uri, filetype = vim.bo[bufnr].filetype, hovers = {} }
    table.insert(results.files, seen)

    -- buf_get_clients lists a client only once it is initialised.
    assert(vim.wait(timeout, function()
      for id, c in pairs(vim.lsp.buf_get_clients(bufnr)) do
        if c.name == 'walden' then
          client_id = id
          return true
        end
      end
      return exited ~= nil
    end, 10), 'walden did not attach to ' .. file.path .. ' (filetype ' .. seen.filetype
      .. ') or initialize did not complete within ' .. timeout .. ' ms')
    assert(exited == nil, 'walden serve exited during start-up')

    -- Diagnostics for the version Neovim opened.
    local opened = vim.lsp.util.buf_versions[bufnr] or 0
    seen.opened_version = opened
    vim.wait(timeout, function()
      return latest(uri, opened) ~= nil
    end, 10)
    seen.after_open = or_null(latest(uri, opened))
    seen.shown = vim.diagnostic.get(bufnr)

    for _, pos in ipairs(file.hovers or {}) do
      local replies, err = vim.lsp.buf_request_sync(bufnr, 'textDocument/hover', {
        textDocument = { uri = uri },
        position = { line = pos.line, character = pos.character },
      }, timeout)
      local reply = replies and replies[client_id] or {}
      table.insert(seen.hovers, {
        line = pos.line,
        character = pos.character,
        result = or_null(reply.result),
        error = or_null(reply.err or err),
      })
    end

    -- An edit goes through Neovim's own change tracking and its 150 ms
    -- didChange debounce; the diagnostics must come back for the new version.
    if file.edit then
      seen.edit_at_ms = vim.loop.now()
      vim.api.nvim_buf_set_lines(bufnr, file.edit.line, file.edit.line + 1, false, { file.edit.text })
      local edited = vim.lsp.util.buf_versions[bufnr]
      seen.edited_version = edited
      vim.wait(timeout, function()
        return latest(uri, edited) ~= nil
      end, 10)
      seen.after_edit = or_null(latest(uri, edited))
      seen.shown_after_edit = vim.diagnostic.get(bufnr)
    end
  end

  -- shutdown then exit, as Neovim does when a chemist quits.
  if client_id then
    vim.lsp.stop_client(client_id)
    vim.wait(timeout, function()
      return exited ~= nil
    end, 10)
  end
  results.exit = or_null(exited)
end

local ok, err = xpcall(main, debug.traceback)
if not ok then
  results.error = tostring(err)
end
local wrote, werr = pcall(write_results)
if not wrote then
  io.stderr:write('e2e.lua: cannot write results: ' .. tostring(werr) .. '\n')
end
if ok and wrote then
  vim.cmd('qall!')
else
  io.stderr:write(tostring(err) .. '\n')
  vim.cmd('cquit')
end
