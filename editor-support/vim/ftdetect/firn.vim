" firn models: plane building frames and their loads.
au BufRead,BufNewFile *.firn set filetype=firn
