-- walden for Neovim: starts `walden serve` for Markdown notebook pages and
-- .steps plan files and attaches it to their buffers.
--
-- It uses only vim.lsp.start_client and vim.lsp.buf_attach_client, which
-- every Neovim from 0.7 on has, so the same file works on Debian 12's
-- Neovim 0.7.2 and on newer releases. On Neovim 0.8 and later you may use
-- vim.lsp.start or (0.11+) vim.lsp.config instead; see README.md.
--
-- Usage, in init.lua:
--
--   require('walden').setup({})                       -- walden on PATH
--   require('walden').setup({ cmd = { '/opt/walden/bin/walden', 'serve' } })
local M = {}

-- defaults are the settings a chemist gets without writing any.
local defaults = {
  -- cmd is the server command; every editor set-up launches the same one.
  cmd = { 'walden', 'serve' },
  -- filetypes are the buffers walden reads. Markdown pages carry steps in
  -- fenced ```reaction blocks; walden-steps is the filetype this module
  -- gives to *.steps plan files.
  filetypes = { 'markdown', 'walden-steps' },
  -- root_markers name files whose folder is the project: one server runs
  -- per project folder. Without a marker the file's own folder is used.
  root_markers = { 'walden.settings', '.git' },
  -- settings are sent to the server as workspace/didChangeConfiguration
  -- ({ walden = settings }) once it has started. walden understands
  --   names = 'lab-names.txt'            your lab's names file
  --   disable = { 'some-code' }           diagnostic codes not to report
  --   solvent = 'DMF'                     assumed when a step names none
  --   temperature = 25                    °C, assumed when a step gives none
  -- and also reads a walden.settings file in the notebook folder.
  settings = {},
  -- on_init and on_attach are passed through to vim.lsp.start_client, so
  -- you can add key maps; see README.md.
  on_init = nil,
  on_attach = nil,
  -- on_exit(code, signal, client_id) is called when the server ends.
  on_exit = nil,
  -- debounce_text_changes is how long (ms) Neovim waits after a keystroke
  -- before it sends didChange. 150 ms is Neovim 0.7's own default.
  debounce_text_changes = 150,
}

M.config = vim.deepcopy(defaults)

-- clients maps a project folder to the id of the client serving it.
local clients = {}

-- find_root returns the nearest folder above path that holds one of the
-- root markers, or path's own folder.
local function find_root(path)
  local dir = vim.fn.fnamemodify(path, ':p:h')
  for _, marker in ipairs(M.config.root_markers) do
    local file = vim.fn.findfile(marker, dir .. ';')
    if file ~= '' then
      return vim.fn.fnamemodify(file, ':p:h')
    end
    -- ':p' ends a folder with '/', so ':h' twice steps out of the marker.
    local folder = vim.fn.finddir(marker, dir .. ';')
    if folder ~= '' then
      return vim.fn.fnamemodify(folder, ':p:h:h')
    end
  end
  return dir
end

local function start(root)
  local cfg = M.config
  local id = vim.lsp.start_client({
    name = 'walden',
    cmd = cfg.cmd,
    root_dir = root,
    workspace_folders = {
      { uri = vim.uri_from_fname(root), name = vim.fn.fnamemodify(root, ':t') },
    },
    settings = { walden = cfg.settings },
    flags = { debounce_text_changes = cfg.debounce_text_changes },
    on_init = function(client, result)
      -- Neovim does not send settings by itself (see :h vim.lsp.start_client).
      if next(cfg.settings) ~= nil then
        client.notify('workspace/didChangeConfiguration', { settings = { walden = cfg.settings } })
      end
      if cfg.on_init then
        cfg.on_init(client, result)
      end
    end,
    on_attach = cfg.on_attach,
    on_exit = function(code, signal, client_id)
      if clients[root] == client_id then
        clients[root] = nil
      end
      if cfg.on_exit then
        cfg.on_exit(code, signal, client_id)
      end
    end,
  })
  if not id then
    vim.notify('walden: could not start ' .. table.concat(cfg.cmd, ' ')
      .. '; is walden installed? See editors/nvim/README.md', vim.log.levels.ERROR)
  end
  return id
end

-- attach connects buffer bufnr to the server of its project, starting the
-- server if it is not running yet. It returns the client id, or nil.
function M.attach(bufnr)
  bufnr = (bufnr == nil or bufnr == 0) and vim.api.nvim_get_current_buf() or bufnr
  if vim.bo[bufnr].buftype ~= '' then
    return nil
  end
  local name = vim.api.nvim_buf_get_name(bufnr)
  local root = name ~= '' and find_root(name) or vim.fn.getcwd()
  local id = clients[root]
  if id == nil or vim.lsp.get_client_by_id(id) == nil then
    id = start(root)
    if id == nil then
      return nil
    end
    clients[root] = id
  end
  vim.lsp.buf_attach_client(bufnr, id)
  return id
end

-- setup merges opts into the defaults and installs the autocommands that
-- recognise *.steps files and attach walden to the configured filetypes.
function M.setup(opts)
  M.config = vim.tbl_deep_extend('force', vim.deepcopy(defaults), opts or {})
  local group = vim.api.nvim_create_augroup('walden', { clear = true })
  vim.api.nvim_create_autocmd({ 'BufRead', 'BufNewFile' }, {
    group = group,
    pattern = '*.steps',
    callback = function()
      vim.bo.filetype = 'walden-steps'
      -- Plan files use '//' for comments; commentstring makes gc-style
      -- commenting plug-ins use it too.
      vim.bo.commentstring = '// %s'
    end,
  })
  vim.api.nvim_create_autocmd('FileType', {
    group = group,
    pattern = M.config.filetypes,
    callback = function(args)
      M.attach(args.buf)
    end,
  })
  -- Buffers opened before setup ran (e.g. `nvim notes.md`) attach now.
  for _, bufnr in ipairs(vim.api.nvim_list_bufs()) do
    if vim.api.nvim_buf_is_loaded(bufnr) and vim.tbl_contains(M.config.filetypes, vim.bo[bufnr].filetype) then
      M.attach(bufnr)
    end
  end
end

return M
